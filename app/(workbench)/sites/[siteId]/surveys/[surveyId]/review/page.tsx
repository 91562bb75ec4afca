import { notFound } from 'next/navigation';
import { ReviewQueue } from '@/components/review/ReviewQueue';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';
import { getSite } from '@/lib/services/sites';
import { getSurvey } from '@/lib/services/surveys';

export const metadata = { title: 'Review queue' };

export default async function ReviewPage({ params }: { params: Promise<{ siteId: string; surveyId: string }> }) {
  const { siteId: rawSiteId, surveyId: rawSurveyId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'survey.read');
  const surveyId = Number(rawSurveyId);
  const survey = Number.isInteger(surveyId) ? await getSurvey(surveyId).catch(() => null) : null;
  if (!survey || survey.siteId !== siteId) notFound();
  const [areas, site] = await Promise.all([listAreas(siteId), getSite(siteId)]);
  return (
    <div className="space-y-3">
      <h2 className="text-lg font-semibold">Review · {survey.name}</h2>
      <ReviewQueue siteId={siteId} surveyId={surveyId} areas={areas.map((a) => ({ id: a.id, name: a.name }))}
        canDecide={may(actor, 'verdict.confirm') && survey.status !== 'published'} timeZone={site.timeZone} />
    </div>
  );
}
