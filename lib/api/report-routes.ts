// Part of the route list (lib/api/routes.ts joins it in).
import { z } from 'zod';
import { CSV_TABLES, REPORT_FORMATS } from '@/lib/reports/report-data';
import { idSchema } from '@/lib/validation/common';
import { defineRoute, type RouteSpec } from './spec';

export const REPORT_ROUTES = {
  surveyReport: defineRoute({
    method: 'GET', path: '/api/surveys/{surveyId}/report', permission: 'survey.read', tag: 'Outcomes',
    summary: 'The survey report as a file: PDF (application/pdf), spreadsheet (xlsx, one sheet per table) or CSV (the failed traps, or the figures by area with table=areas). '
      + 'A draft says that its figures follow the current settings; a published report carries its publication date. Text cells are neutralised against formulas.',
    params: z.object({ surveyId: idSchema }),
    query: z.object({
      format: z.enum(REPORT_FORMATS).default('pdf').describe('pdf, xlsx or csv'),
      table: z.enum(CSV_TABLES).default('failures').describe('which table a CSV holds: failures (costliest first) or areas'),
    }),
  }),
  emailSurveyReport: defineRoute({
    method: 'POST', path: '/api/surveys/{surveyId}/report-email', permission: 'report.publish', tag: 'Outcomes',
    summary: "E-mail a published survey to the site's viewers: headline figures and links (access is checked again when a link is opened).",
    params: z.object({ surveyId: idSchema }),
    response: z.object({ recipients: z.array(z.object({ email: z.string(), sent: z.boolean() })) }),
  }),
} as const satisfies Record<string, RouteSpec>;
