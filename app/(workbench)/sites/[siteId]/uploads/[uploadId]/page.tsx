import { UploadDetailView } from '@/components/uploads/UploadDetailView';
import { may, requireSiteActor } from '@/lib/auth/page';
import { getSite } from '@/lib/services/sites';
import { uploadIdForPage } from './upload-for-page';

export const metadata = { title: 'Upload' };

export default async function UploadPage({ params }: { params: Promise<{ siteId: string; uploadId: string }> }) {
  const { siteId: rawSiteId, uploadId: rawUploadId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'upload.read');
  const uploadId = await uploadIdForPage(siteId, rawUploadId);
  const site = await getSite(siteId);
  return <UploadDetailView siteId={siteId} uploadId={uploadId} canMap={may(actor, 'mapping.apply')} siteTimeZone={site.timeZone} />;
}
