import Link from 'next/link';
import { notFound } from 'next/navigation';
import { SafetyCaution } from '@/components/SafetyCaution';
import { PlanWorkOrders } from '@/components/work-orders/PlanWorkOrders';
import { requireSiteActor } from '@/lib/auth/page';
import { getSurvey } from '@/lib/services/surveys';
import { workOrderCandidates } from '@/lib/services/work-orders';

export const metadata = { title: 'Plan work orders' };

export default async function PlanWorkOrdersPage({ params }: { params: Promise<{ siteId: string; surveyId: string }> }) {
  const { siteId: rawSiteId, surveyId: rawSurveyId } = await params;
  const { siteId } = await requireSiteActor(rawSiteId, 'workorder.plan');
  const surveyId = Number(rawSurveyId);
  const survey = Number.isInteger(surveyId) && surveyId > 0 ? await getSurvey(surveyId).catch(() => null) : null;
  if (!survey || survey.siteId !== siteId) notFound();
  const candidates = await workOrderCandidates(surveyId);
  return (
    <div className="space-y-4">
      <div>
        <Link href={`/sites/${siteId}/work-orders`} className="text-sm text-ink-soft hover:underline">← Work orders</Link>
        <h2 className="text-lg font-semibold">Plan repairs: {candidates.surveyName}</h2>
        <p className="text-sm text-ink-soft">
          The survey&apos;s confirmed failures, most urgent first. Pick traps, set the action, the technician and the due date, and create the work orders;
          each technician is e-mailed. Priority comes from the yearly cost and the trap&apos;s criticality; a cold trap draining a steam main ranks high whatever its cost.
        </p>
      </div>
      <PlanWorkOrders siteId={siteId} surveyId={surveyId} candidates={candidates} />
      <SafetyCaution context="Plan repairs with isolation in mind" compact />
    </div>
  );
}
