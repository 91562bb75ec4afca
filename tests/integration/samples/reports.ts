import type { REPORT_ROUTES } from '@/lib/api/report-routes';
import type { Sample } from './sample';

export const REPORT_SAMPLES: Record<keyof typeof REPORT_ROUTES, Sample> = {
  surveyReport: (s) => ({ params: { surveyId: s.surveyId } }),
  // The demo's published spring survey of the site (the other site has a viewer only on Fenwick Vale,
  // so the 404 case never reaches sending).
  emailSurveyReport: async (s, { admin }) => {
    const surveys = (await admin.get(`/api/sites/${s.siteId}/surveys`)).body.items as { id: number; name: string; status: string }[];
    return { params: { surveyId: surveys.find((x) => x.status === 'published' && x.name.startsWith('Spring'))!.id } };
  },
};
