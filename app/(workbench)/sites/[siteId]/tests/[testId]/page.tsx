import { notFound } from 'next/navigation';
import { TestDetailView } from '@/components/review/TestDetailView';
import { may, requireSiteActor } from '@/lib/auth/page';
import { getSite } from '@/lib/services/sites';
import { siteIdOfTest } from '@/lib/services/tests';

export const metadata = { title: 'Test' };

export default async function TestPage({ params }: { params: Promise<{ siteId: string; testId: string }> }) {
  const { siteId: rawSiteId, testId: rawTestId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'survey.read');
  const testId = Number(rawTestId);
  if (!Number.isInteger(testId) || (await siteIdOfTest(testId)) !== siteId) notFound();
  const site = await getSite(siteId);
  return <TestDetailView testId={testId} siteId={siteId} canDecide={may(actor, 'verdict.confirm')} timeZone={site.timeZone} />;
}
