import { TagDecisions } from '@/components/uploads/TagDecisions';
import { requireSiteActor } from '@/lib/auth/page';
import { listAreas } from '@/lib/services/areas';
import { uploadIdForPage } from '../upload-for-page';

export const metadata = { title: 'Match tags' };

export default async function UploadTagsPage({ params }: { params: Promise<{ siteId: string; uploadId: string }> }) {
  const { siteId: rawSiteId, uploadId: rawUploadId } = await params;
  const { siteId } = await requireSiteActor(rawSiteId, 'mapping.apply');
  const uploadId = await uploadIdForPage(siteId, rawUploadId);
  const areas = await listAreas(siteId);
  return <TagDecisions siteId={siteId} uploadId={uploadId} areas={areas.map((a) => ({ id: a.id, name: a.name }))} />;
}
