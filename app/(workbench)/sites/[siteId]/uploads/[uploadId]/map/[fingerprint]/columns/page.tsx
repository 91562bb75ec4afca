import { MappingWizard } from '@/components/uploads/wizard/MappingWizard';
import { wizardForPage, type WizardParams } from '../wizard-for-page';

export const metadata = { title: 'Map a layout' };

export default async function MapColumnsPage({ params }: { params: WizardParams }) {
  return <MappingWizard step="columns" state={await wizardForPage(params)} />;
}
