import { RegisterImport } from '@/components/register/RegisterImport';
import { requireSiteActor } from '@/lib/auth/page';

export const metadata = { title: 'Import register' };

export default async function RegisterImportPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await requireSiteActor((await params).siteId, 'register.import');
  return <RegisterImport siteId={siteId} />;
}
