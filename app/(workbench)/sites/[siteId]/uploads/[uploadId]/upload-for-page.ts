import 'server-only';
import { notFound } from 'next/navigation';
import { siteIdOfUpload } from '@/lib/services/uploads';

/** The upload id of a page under /sites/[siteId]/uploads/[uploadId]: a 404 unless it belongs to this site. */
export async function uploadIdForPage(siteId: number, rawUploadId: string): Promise<number> {
  const uploadId = Number(rawUploadId);
  if (!Number.isInteger(uploadId) || uploadId <= 0) notFound();
  if ((await siteIdOfUpload(uploadId)) !== siteId) notFound();
  return uploadId;
}
