import { redirect } from 'next/navigation';
import { wizardForPage, type WizardParams } from './wizard-for-page';

// The layout's link without a step resumes the step saved in the draft.
export default async function MapLayoutPage({ params }: { params: WizardParams }) {
  const state = await wizardForPage(params);
  const step = state.draft && ['format', 'columns', 'save'].includes(state.draft.step) ? state.draft.step : 'format';
  redirect(`/sites/${state.siteId}/uploads/${state.uploadId}/map/${encodeURIComponent(state.fingerprint)}/${step}`);
}
