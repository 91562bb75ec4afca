import { UploadsWorkbench } from '@/components/uploads/UploadsWorkbench';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listSurveys } from '@/lib/services/surveys';

export const metadata = { title: 'Uploads' };

export default async function UploadsPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'upload.read');
  const surveys = await listSurveys(siteId);
  // The survey in progress by default; a published survey is frozen and is offered only to be refused clearly.
  const current = surveys.find((s) => s.status === 'in_progress') ?? surveys.find((s) => s.status === 'planned') ?? null;
  return (
    <UploadsWorkbench
      siteId={siteId}
      surveys={surveys.map((s) => ({ id: s.id, name: s.name, status: s.status }))}
      defaultSurveyId={current?.id ?? null}
      canUpload={may(actor, 'upload.create')}
    />
  );
}
