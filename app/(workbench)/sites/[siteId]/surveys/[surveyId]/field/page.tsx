import Link from 'next/link';
import { notFound } from 'next/navigation';
import { FieldWorkList } from '@/components/field/FieldWorkList';
import { SafetyCaution } from '@/components/SafetyCaution';
import { requireSiteActor } from '@/lib/auth/page';
import { fieldWork } from '@/lib/services/field-notes';
import { getSurvey } from '@/lib/services/surveys';

export const metadata = { title: 'Field view' };

/** The technician's view of a survey: where to go, what to test again, and what was found on the way. */
export default async function FieldPage({ params }: { params: Promise<{ siteId: string; surveyId: string }> }) {
  const { siteId: rawSiteId, surveyId: rawSurveyId } = await params;
  const { actor, siteId } = await requireSiteActor(rawSiteId, 'survey.read');
  const surveyId = Number(rawSurveyId);
  const survey = Number.isInteger(surveyId) ? await getSurvey(surveyId).catch(() => null) : null;
  if (!survey || survey.siteId !== siteId) notFound();
  const initial = await fieldWork(actor, surveyId);
  return (
    <div className="space-y-4">
      <div>
        <Link href={`/sites/${siteId}/surveys/${surveyId}`} className="text-sm text-ink-soft hover:underline">← {survey.name}</Link>
        <h2 className="text-lg font-semibold">Field view · {survey.name}</h2>
        <p className="text-sm text-ink-soft">Re-tests asked for come first, then the traps still to test. Note what stops a test, so the analyst knows why a trap has none.</p>
      </div>
      <SafetyCaution context="Before you walk the plant" compact />
      <FieldWorkList siteId={siteId} surveyId={surveyId} initial={initial} published={survey.status === 'published'} />
    </div>
  );
}
