import Link from 'next/link';
import { SurveyStatusLabel } from '@/components/SurveyStatus';
import { SurveyForm } from '@/components/surveys/SurveyForm';
import { may, requireSiteActor } from '@/lib/auth/page';
import { listSurveys } from '@/lib/services/surveys';

export const metadata = { title: 'Surveys' };

export default async function SurveysPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { actor, siteId } = await requireSiteActor((await params).siteId, 'survey.read');
  const surveys = await listSurveys(siteId);
  return (
    <div className="space-y-4">
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead><tr><th>Survey</th><th>Starts</th><th>Ends</th><th>Status</th><th /></tr></thead>
          <tbody>
            {surveys.map((s) => (
              <tr key={s.id}><td className="font-medium"><Link className="hover:text-accent-700 hover:underline" href={`/sites/${siteId}/surveys/${s.id}`}>{s.name}</Link></td><td>{s.startsOn}</td><td>{s.endsOn}</td><td><SurveyStatusLabel status={s.status} /></td>
                <td className="text-right"><Link className="text-sm text-accent-700 hover:underline" href={`/sites/${siteId}/surveys/${s.id}/review`}>Review queue</Link></td></tr>
            ))}
          </tbody>
        </table>
      </div>
      {may(actor, 'survey.write') && <SurveyForm siteId={siteId} />}
    </div>
  );
}
