import { MappingWizard } from '@/components/uploads/wizard/MappingWizard';
import { wizardForPage, type WizardParams } from '../wizard-for-page';

export const metadata = { title: 'Map a layout' };

export default async function MapFormatPage({ params }: { params: WizardParams }) {
  return <MappingWizard step="format" state={await wizardForPage(params)} />;
}
