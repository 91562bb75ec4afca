import 'server-only';
import { requireSiteActor } from '@/lib/auth/page';
import type { WizardState } from '@/components/uploads/wizard/draftProfile';
import type { LayoutDetection } from '@/lib/import/detect-layout';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import { getSite } from '@/lib/services/sites';
import { getUpload } from '@/lib/services/uploads';
import { uploadIdForPage } from '../../upload-for-page';

export type WizardParams = Promise<{ siteId: string; uploadId: string; fingerprint: string }>;


/** Everything a wizard step loads from the server: the layout's detection and the saved draft. */
export async function wizardForPage(params: WizardParams): Promise<WizardState> {
  const raw = await params;
  const { siteId } = await requireSiteActor(raw.siteId, 'mapping.apply');
  const uploadId = await uploadIdForPage(siteId, raw.uploadId);
  // The fingerprint holds a colon, sent encoded; decode it whether or not the router has.
  const fingerprint = raw.fingerprint.includes('%') ? decodeURIComponent(raw.fingerprint) : raw.fingerprint;
  const [upload, site] = await Promise.all([getUpload(uploadId), getSite(siteId)]);
  const found = upload.unknownLayouts.find((l) => l.fingerprint === fingerprint);
  const byId = new Map(upload.files.map((f) => [f.id, f]));
  const draft = upload.mappingDraft?.[fingerprint];
  return {
    siteId,
    uploadId,
    siteTimeZone: site.timeZone,
    fingerprint,
    layout: found
      ? {
          fileIds: found.fileIds,
          fileNames: found.fileIds.map((id) => byId.get(id)).map((f) => (f ? (f.entry ?? f.name) : '')),
          detection: found.detection as unknown as LayoutDetection | null,
        }
      : null,
    draft: draft ? { ...draft, profile: draft.profile as InstrumentProfile } : null,
  };
}
