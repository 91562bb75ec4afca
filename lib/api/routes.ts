// The API's route list: every route handler under app/api takes its spec from here, and the
// OpenAPI document and the route tests are generated from it. A route not listed here does not exist.
import { z } from 'zod';
import {
  MATCH_STATUSES, ROLES, SOURCE_FILE_STATUSES, SURVEY_STATUSES, TEST_ROLES, TRAP_TYPES, UNIT_SYSTEMS, UPLOAD_STATUSES, USER_STATUSES,
} from '@/lib/domain/vocabulary';
import { InstrumentProfileSchema } from '@/lib/import/instrument-profile';
import { VERDICT_CODES } from '@/lib/analysis/verdict-codes';
import { apiTokenInputSchema } from '@/lib/validation/api-token';
import { costSettingsSchema } from '@/lib/validation/cost-settings';
import { areaInputSchema } from '@/lib/validation/area';
import { idSchema } from '@/lib/validation/common';
import { siteInputSchema, siteUpdateSchema } from '@/lib/validation/site';
import { surveyInputSchema } from '@/lib/validation/survey';
import { trapInputSchema, trapListQuerySchema, trapUpdateSchema } from '@/lib/validation/trap';
import { userInputSchema, userUpdateSchema } from '@/lib/validation/user';
import { FIELD_NOTE_ROUTES } from './field-note-routes';
import { REPORT_ROUTES } from './report-routes';
import { defineRoute } from './spec';
import { WORK_ORDER_ROUTES } from './work-order-routes';

const siteParams = z.object({ siteId: idSchema });
const MAX_REGISTER_CSV = 5_000_000;

const site = z.object({
  id: z.number(), name: z.string(), code: z.string(), timeZone: z.string(), currency: z.string(),
  unitSystem: z.enum(UNIT_SYSTEMS), ambientC: z.number(),
});
const survey = z.object({
  id: z.number(), siteId: z.number(), name: z.string(), startsOn: z.string(), endsOn: z.string(),
  status: z.enum(SURVEY_STATUSES), publishedAt: z.string().nullable(),
});
const area = z.object({ id: z.number(), siteId: z.number(), name: z.string(), description: z.string().nullable() });
const trap = z.object({
  id: z.number(), siteId: z.number(), tag: z.string(), areaId: z.number().nullable(), areaName: z.string().nullable(),
  location: z.string().nullable(), trapType: z.enum(TRAP_TYPES), application: z.string().nullable(),
  sizeDn: z.number().nullable(), orificeMm: z.number().nullable(), pressureBarg: z.number(),
  dischargesTo: z.string(), criticality: z.string(), status: z.string(), updatedAt: z.string(),
});
const user = z.object({
  id: z.number(), email: z.string(), name: z.string(), role: z.enum(ROLES), status: z.enum(USER_STATUSES),
  lastSignInAt: z.string().nullable(), siteIds: z.array(z.number()),
});
const apiToken = z.object({
  id: z.number(), userId: z.number(), userName: z.string().nullable(), name: z.string(), prefix: z.string(),
  readOnly: z.boolean(), siteIds: z.array(z.number()).nullable(), lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(), createdAt: z.string(),
});
const registerProblem = z.object({
  code: z.string(), line: z.number(), column: z.string().optional(), message: z.string(), severity: z.enum(['error', 'warning']),
});
const registerPlan = z.object({
  rows: z.array(z.object({
    line: z.number(), tag: z.string(), action: z.enum(['create', 'update', 'unchanged']),
    changes: z.record(z.string(), z.tuple([z.unknown(), z.unknown()])), area: z.string().nullable(),
  })),
  newAreas: z.array(z.string()),
  problems: z.array(registerProblem),
  counts: z.object({ create: z.number(), update: z.number(), unchanged: z.number(), rejected: z.number() }),
  blocked: z.boolean(),
});
const registerCsvBody = z.object({
  csv: z.string().max(MAX_REGISTER_CSV, 'A register file is at most 5 MB.'),
  fileName: z.string().max(200).optional(),
});

const upload = z.object({
  id: z.number(), siteId: z.number(), surveyId: z.number(), surveyName: z.string().nullable(), status: z.enum(UPLOAD_STATUSES),
  createdBy: z.string().nullable(), createdAt: z.string(), startedAt: z.string().nullable(), finishedAt: z.string().nullable(),
  progress: z.object({ filesTotal: z.number(), filesDone: z.number(), tests: z.number(), samples: z.number() }),
  error: z.string().nullable(),
});
const sourceFile = z.object({
  id: z.number(), containerId: z.number().nullable(), name: z.string(), entry: z.string().nullable(), kind: z.enum(['file', 'zip', 'entry']),
  sha256: z.string(), size: z.number(), status: z.enum(SOURCE_FILE_STATUSES), fingerprint: z.string().nullable(),
  profileId: z.number().nullable(), profileRevision: z.number().nullable(), testCount: z.number(), duplicateOf: z.number().nullable(),
  hints: z.array(z.string()), rowCounts: z.record(z.string(), z.number()).nullable(),
  problems: z.array(z.record(z.string(), z.unknown())).describe('each: code, severity, file, entry, line, column, message, expected'),
});
const uploadDetail = upload.extend({
  files: z.array(sourceFile),
  unmatchedTags: z.array(z.object({ tag: z.string(), tests: z.number(), roles: z.array(z.enum(TEST_ROLES)) }))
    .describe('tags of imported tests the register does not know (held back until mapped, created or ignored)'),
  mappingDraft: z.record(z.string(), z.object({ step: z.string(), profile: z.unknown(), updatedBy: z.string(), updatedAt: z.string() })).nullable()
    .describe("the mapping wizard's saved state, per layout fingerprint"),
  unknownLayouts: z.array(z.object({ fingerprint: z.string(), fileIds: z.array(z.number()), detection: z.record(z.string(), z.unknown()).nullable() })),
});
const profile = z.object({
  id: z.number(), name: z.string(), fingerprint: z.string(), revision: z.number(), definition: z.unknown(),
  createdBy: z.string().nullable(), updatedAt: z.string(),
});
const profileBody = z.object({
  name: z.string().trim().min(1, 'Name the meter model, e.g. "Model A, firmware 3".').max(120),
  fingerprint: z.string().regex(/^hf1:[0-9a-f]{32}$/, 'A header fingerprint as the detection gives it (hf1:…).').optional()
    .describe("the layout's header fingerprint; omitted: computed from the definition's delimiter, header, preamble keys and units row"),
  definition: InstrumentProfileSchema,
});
const testSummary = z.object({
  id: z.number(), siteId: z.number(), surveyId: z.number(), uploadId: z.number(), sourceFileId: z.number(), trapId: z.number().nullable(),
  tag: z.string(), role: z.enum(TEST_ROLES), linkedTrapTag: z.string().nullable(), matchStatus: z.enum(MATCH_STATUSES),
  startedAt: z.string(), durationS: z.number(), sampleRateHz: z.number(), sampleCount: z.number(),
  meanLevelDb: z.number().nullable(), dutyCycle: z.number().nullable(), suggestedVerdict: z.string().nullable(),
  confidence: z.string().nullable(), lossKgPerHour: z.number().nullable(), figures: z.unknown(),
});
const testListQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(100),
  surveyId: idSchema.optional(),
  uploadId: idSchema.optional(),
  trapId: idSchema.optional(),
  role: z.enum(TEST_ROLES).optional(),
  figures: z.enum(['none', 'full']).default('none').describe("'full' adds each test's whole figures (a few kB a test)"),
});
const seriesQuery = z.object({
  points: z.coerce.number().int().min(10).max(20_000).default(2000).describe('buckets of min/max when decimating'),
  from: z.coerce.number().min(0).optional().describe('window start, seconds from the test start (full resolution inside a window)'),
  to: z.coerce.number().min(0).optional().describe('window end, seconds from the test start'),
});
const tagDecision = z.discriminatedUnion('action', [
  z.object({ tag: z.string().min(1).max(80), action: z.literal('map'), trapId: idSchema }),
  z.object({ tag: z.string().min(1).max(80), action: z.literal('create'), trap: trapInputSchema.omit({ tag: true }) }),
  z.object({ tag: z.string().min(1).max(80), action: z.literal('ignore') }),
]);

const reviewState = z.enum(['unreviewed', 'confirmed', 'overridden', 'retest_pending']);
const reviewItem = z.object({
  trapId: z.number(), tag: z.string(), areaId: z.number().nullable(), areaName: z.string().nullable(), trapType: z.enum(TRAP_TYPES),
  pressureBarg: z.number(), criticality: z.string(), latestTestId: z.number(), testCount: z.number(), hasReference: z.boolean(),
  suggested: z.string().nullable(), confidence: z.string().nullable(), lossKgPerHour: z.number().nullable(),
  meanLevelDb: z.number().nullable(), dutyCycle: z.number().nullable(), state: reviewState, verdict: z.string().nullable(),
  reason: z.string().nullable(), decidedBy: z.string().nullable(), decidedAt: z.string().nullable(),
});
const reviewQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(5000).default(500),
  uploadId: idSchema.optional(),
  areaId: idSchema.optional(),
  trapType: z.enum(TRAP_TYPES).optional(),
  verdict: z.enum(VERDICT_CODES).optional(),
  reviewed: z.enum(['yes', 'no', 'retest']).optional(),
});
const reasonText = z.string().trim().max(2000);
const decisionBody = z.discriminatedUnion('action', [
  z.object({ trapId: idSchema, action: z.literal('confirm'), testId: idSchema, reason: reasonText.optional() }),
  z.object({ trapId: idSchema, action: z.literal('override'), testId: idSchema, verdict: z.enum(VERDICT_CODES), reason: reasonText.min(3, 'Say why you override the suggestion.') }),
  z.object({ trapId: idSchema, action: z.literal('retest'), reason: reasonText.optional() }),
]);

const CORE_ROUTES = {
  me: defineRoute({
    method: 'GET', path: '/api/me', permission: 'site.read', tag: 'Account',
    summary: 'Who is calling: user, role, the sites they may see, and whether the call is read-only.',
    response: z.object({
      userId: z.number(), name: z.string(), email: z.string(), role: z.enum(ROLES),
      via: z.enum(['session', 'token']), readOnly: z.boolean(), siteIds: z.union([z.array(z.number()), z.literal('all')]),
    }),
  }),
  listSites: defineRoute({
    method: 'GET', path: '/api/sites', permission: 'site.read', tag: 'Sites',
    summary: 'The sites the caller belongs to, with register counts and surveys.',
    response: z.object({ items: z.array(site.extend({ trapCount: z.number(), inServiceCount: z.number(), areaCount: z.number(), surveys: z.array(survey) })) }),
  }),
  createSite: defineRoute({
    method: 'POST', path: '/api/sites', permission: 'site.manage', tag: 'Sites', status: 201,
    summary: 'Create a site (admin).', body: siteInputSchema, response: site,
  }),
  getSite: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}', permission: 'site.read', tag: 'Sites',
    summary: 'One site.', params: siteParams, response: site,
  }),
  updateSite: defineRoute({
    method: 'PATCH', path: '/api/sites/{siteId}', permission: 'site.manage', tag: 'Sites',
    summary: 'Change a site (admin).', params: siteParams, body: siteUpdateSchema, response: site,
  }),
  listAreas: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/areas', permission: 'register.read', tag: 'Register',
    summary: "A site's areas with their trap counts.", params: siteParams,
    response: z.object({ items: z.array(area.extend({ trapCount: z.number() })) }),
  }),
  createArea: defineRoute({
    method: 'POST', path: '/api/sites/{siteId}/areas', permission: 'area.write', tag: 'Register', status: 201,
    summary: 'Add an area to a site.', params: siteParams, body: areaInputSchema, response: area,
  }),
  updateArea: defineRoute({
    method: 'PATCH', path: '/api/areas/{areaId}', permission: 'area.write', tag: 'Register',
    summary: 'Rename or describe an area.', params: z.object({ areaId: idSchema }), body: areaInputSchema.partial(), response: area,
  }),
  listTraps: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/traps', permission: 'register.read', tag: 'Register',
    summary: "One page of a site's trap register, sorted and filtered on the server.",
    params: siteParams, query: trapListQuerySchema,
    response: z.object({ items: z.array(trap), total: z.number(), page: z.number(), pageSize: z.number() }),
  }),
  createTrap: defineRoute({
    method: 'POST', path: '/api/sites/{siteId}/traps', permission: 'trap.write', tag: 'Register', status: 201,
    summary: 'Add a trap to the register.', params: siteParams, body: trapInputSchema, response: trap,
  }),
  getTrap: defineRoute({
    method: 'GET', path: '/api/traps/{trapId}', permission: 'register.read', tag: 'Register',
    summary: 'One trap of the register.', params: z.object({ trapId: idSchema }), response: trap,
  }),
  updateTrap: defineRoute({
    method: 'PATCH', path: '/api/traps/{trapId}', permission: 'trap.write', tag: 'Register',
    summary: 'Change a trap (mark it removed rather than deleting it).', params: z.object({ trapId: idSchema }), body: trapUpdateSchema, response: trap,
  }),
  previewRegisterImport: defineRoute({
    method: 'POST', path: '/api/sites/{siteId}/register-imports/preview', permission: 'register.import', tag: 'Register',
    summary: 'What importing a register CSV would do, with every problem by line. Writes nothing.',
    params: siteParams, body: registerCsvBody, response: registerPlan,
  }),
  applyRegisterImport: defineRoute({
    method: 'POST', path: '/api/sites/{siteId}/register-imports', permission: 'register.import', tag: 'Register',
    summary: 'Import a register CSV: upsert by tag, never delete; all valid rows land or none do.',
    params: siteParams, body: registerCsvBody.extend({ skipRejectedRows: z.boolean().default(false) }), response: registerPlan,
  }),
  listSurveys: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/surveys', permission: 'survey.read', tag: 'Surveys',
    summary: "A site's surveys, newest first.", params: siteParams, response: z.object({ items: z.array(survey) }),
  }),
  createSurvey: defineRoute({
    method: 'POST', path: '/api/sites/{siteId}/surveys', permission: 'survey.write', tag: 'Surveys', status: 201,
    summary: 'Plan a survey.', params: siteParams, body: surveyInputSchema, response: survey,
  }),
  listUsers: defineRoute({
    method: 'GET', path: '/api/users', permission: 'user.manage', tag: 'Account',
    summary: 'Every user with role, status and sites (admin).', response: z.object({ items: z.array(user) }),
  }),
  createUser: defineRoute({
    method: 'POST', path: '/api/users', permission: 'user.manage', tag: 'Account', status: 201,
    summary: 'Create a user (admin).', body: userInputSchema, response: user,
  }),
  updateUser: defineRoute({
    method: 'PATCH', path: '/api/users/{userId}', permission: 'user.manage', tag: 'Account',
    summary: 'Change role, status, sites or password (admin). A disabled user is refused on their next request.',
    params: z.object({ userId: idSchema }), body: userUpdateSchema, response: user,
  }),
  listApiTokens: defineRoute({
    method: 'GET', path: '/api/api-tokens', permission: 'token.manage', tag: 'Account',
    summary: 'Every API token (never the secrets).', response: z.object({ items: z.array(apiToken) }),
  }),
  createApiToken: defineRoute({
    method: 'POST', path: '/api/api-tokens', permission: 'token.manage', tag: 'Account', status: 201,
    summary: 'Create an API token; the secret is in this response only.', body: apiTokenInputSchema,
    response: apiToken.extend({ secret: z.string() }),
  }),
  revokeApiToken: defineRoute({
    method: 'DELETE', path: '/api/api-tokens/{tokenId}', permission: 'token.manage', tag: 'Account',
    summary: 'Revoke an API token at once.', params: z.object({ tokenId: idSchema }), response: apiToken,
  }),
  createUpload: defineRoute({
    method: 'POST', path: '/api/surveys/{surveyId}/uploads', permission: 'upload.create', tag: 'Uploads', status: 201,
    summary: 'Upload meter exports (CSV files and zips) into a survey as multipart/form-data, one part per file. Stored as received; processed in the background.',
    params: z.object({ surveyId: idSchema }), response: uploadDetail,
  }),
  listUploads: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/uploads', permission: 'upload.read', tag: 'Uploads',
    summary: "A site's uploads, newest first, with progress.", params: siteParams, response: z.object({ items: z.array(upload) }),
  }),
  getUpload: defineRoute({
    method: 'GET', path: '/api/uploads/{uploadId}', permission: 'upload.read', tag: 'Uploads',
    summary: 'An upload with its files, status, progress, detected layouts, suggested mappings and every problem.',
    params: z.object({ uploadId: idSchema }), response: uploadDetail,
  }),
  applyProfileToUpload: defineRoute({
    method: 'POST', path: '/api/uploads/{uploadId}/apply-profile', permission: 'mapping.apply', tag: 'Uploads',
    summary: "Read an upload's files with an instrument profile: those waiting for a mapping, or (reprocess) all of the profile's layout again.",
    params: z.object({ uploadId: idSchema }),
    body: z.object({ profileId: idSchema, reprocess: z.boolean().default(false) }), response: uploadDetail,
  }),
  previewMapping: defineRoute({
    method: 'POST', path: '/api/uploads/{uploadId}/mapping-preview', permission: 'mapping.apply', tag: 'Uploads',
    summary: "Read one of the upload's files with a draft profile, without storing anything: its first tests (decimated) and problems.",
    params: z.object({ uploadId: idSchema }),
    body: z.object({ fileId: idSchema, profile: InstrumentProfileSchema }),
    response: z.object({
      refused: z.boolean(), testCount: z.number(), rowCounts: z.record(z.string(), z.number()).nullable(),
      problems: z.array(z.record(z.string(), z.unknown())),
      tests: z.array(z.object({
        tag: z.string(), role: z.enum(TEST_ROLES), linkedTrapTag: z.string().nullable(), startedAt: z.string(), sampleCount: z.number(),
        sampleRateHz: z.number(), durationS: z.number(), meanLevelDb: z.number().nullable(),
        series: z.object({ t: z.array(z.number()), levelDb: z.array(z.number().nullable()), temperatureC: z.array(z.number().nullable()).nullable() }),
      })),
    }),
  }),
  saveMappingDraft: defineRoute({
    method: 'PUT', path: '/api/uploads/{uploadId}/mapping-draft', permission: 'mapping.apply', tag: 'Uploads',
    summary: "Save the mapping wizard's state for one layout, so a refresh or a colleague's link resumes it.",
    params: z.object({ uploadId: idSchema }),
    body: z.object({ fingerprint: z.string().min(1).max(40), step: z.enum(['format', 'columns', 'tags', 'save']), profile: z.record(z.string(), z.unknown()) }),
    response: z.object({ saved: z.literal(true) }),
  }),
  decideUploadTag: defineRoute({
    method: 'POST', path: '/api/uploads/{uploadId}/tags', permission: 'mapping.apply', tag: 'Uploads',
    summary: 'For a tag the register does not know: map it to a trap, create the trap, or ignore its tests.',
    params: z.object({ uploadId: idSchema }), body: tagDecision, response: z.object({ tag: z.string(), matchStatus: z.enum(MATCH_STATUSES), tests: z.number() }),
  }),
  listProfiles: defineRoute({
    method: 'GET', path: '/api/instrument-profiles', permission: 'upload.read', tag: 'Instrument profiles',
    summary: 'Every instrument profile (meter layouts are shared by all sites).', response: z.object({ items: z.array(profile) }),
  }),
  createProfile: defineRoute({
    method: 'POST', path: '/api/instrument-profiles', permission: 'profile.write', tag: 'Instrument profiles', status: 201,
    summary: 'Save a meter layout as an instrument profile; later uploads with its fingerprint are read without the wizard.',
    body: profileBody, response: profile,
  }),
  getProfile: defineRoute({
    method: 'GET', path: '/api/instrument-profiles/{profileId}', permission: 'upload.read', tag: 'Instrument profiles',
    summary: 'One instrument profile. Its definition is the JSON file a team shares between installations.',
    params: z.object({ profileId: idSchema }), response: profile,
  }),
  updateProfile: defineRoute({
    method: 'PATCH', path: '/api/instrument-profiles/{profileId}', permission: 'profile.write', tag: 'Instrument profiles',
    summary: 'Edit a profile. Past imports keep what they read; re-processing an upload is an explicit action.',
    params: z.object({ profileId: idSchema }), body: profileBody.partial(), response: profile,
  }),
  listTests: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/tests', permission: 'survey.read', tag: 'Tests',
    summary: "A site's tests with their figures, filtered by survey, upload or trap.", params: siteParams, query: testListQuery,
    response: z.object({ items: z.array(testSummary), total: z.number(), page: z.number(), pageSize: z.number() }),
  }),
  getTestSeries: defineRoute({
    method: 'GET', path: '/api/tests/{testId}/series', permission: 'survey.read', tag: 'Tests',
    summary: "A test's readings: min/max per bucket for the whole test, or every reading inside a window.",
    params: z.object({ testId: idSchema }), query: seriesQuery,
    response: z.object({
      testId: z.number(), startedAt: z.string(), sampleCount: z.number(), decimated: z.boolean(),
      t: z.array(z.number()).describe('seconds from the start'), levelDb: z.array(z.number().nullable()), temperatureC: z.array(z.number().nullable()).nullable(),
    }),
  }),
  reviewQueue: defineRoute({
    method: 'GET', path: '/api/surveys/{surveyId}/review-queue', permission: 'survey.read', tag: 'Review',
    summary: 'Every trap tested in a survey, worst first (suggested severity, then estimated loss), with its review state and progress counts.',
    params: z.object({ surveyId: idSchema }), query: reviewQuery,
    response: z.object({
      items: z.array(reviewItem), total: z.number(), page: z.number(), pageSize: z.number(),
      counts: z.object({ traps: z.number(), reviewed: z.number(), retestPending: z.number(), unreviewed: z.number() }),
    }),
  }),
  decideVerdict: defineRoute({
    method: 'POST', path: '/api/surveys/{surveyId}/verdicts', permission: 'verdict.confirm', tag: 'Review',
    summary: 'Confirm the suggested verdict of a trap, override it with a reason, or ask for a re-test. A decided verdict changes only with a reason.',
    params: z.object({ surveyId: idSchema }), body: decisionBody,
    response: z.object({ trapId: z.number(), surveyId: z.number(), state: reviewState.or(z.literal('retest')), verdict: z.string().nullable(), reason: z.string().nullable() }),
  }),
  getTest: defineRoute({
    method: 'GET', path: '/api/tests/{testId}', permission: 'survey.read', tag: 'Tests',
    summary: "One test with its figures, the trap, the reference test used, the trap's decision in the survey and its audit trail.",
    params: z.object({ testId: idSchema }), response: z.record(z.string(), z.unknown()),
  }),
  trapHistory: defineRoute({
    method: 'GET', path: '/api/traps/{trapId}/history', permission: 'register.read', tag: 'Register',
    summary: "A trap across its site's surveys: trap-point tests with their figures, and each survey's decision.",
    params: z.object({ trapId: idSchema }), response: z.object({ items: z.array(z.record(z.string(), z.unknown())) }),
  }),
  getCostSettings: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/cost-settings', permission: 'site.read', tag: 'Outcomes',
    summary: "How the site prices lost steam and counts CO2 (the analysis defaults until an admin sets them; the factor's source and year beside it).",
    params: siteParams, response: costSettingsSchema.extend({ currency: z.string(), isDefault: z.boolean() }),
  }),
  updateCostSettings: defineRoute({
    method: 'PUT', path: '/api/sites/{siteId}/cost-settings', permission: 'settings.cost', tag: 'Outcomes',
    summary: 'Set the site\'s cost and emission settings (admin). Draft surveys follow them; published ones keep theirs.',
    params: siteParams, body: costSettingsSchema, response: costSettingsSchema.extend({ currency: z.string(), isDefault: z.boolean() }),
  }),
  surveySummary: defineRoute({
    method: 'GET', path: '/api/surveys/{surveyId}/summary', permission: 'survey.read', tag: 'Outcomes',
    summary: 'Coverage, verdict counts, failure rate, steam lost, cost and CO2 per year, in total and by area, and the costliest failures (figures.failures, of figures.failureCount); with the settings that produced them.',
    params: z.object({ surveyId: idSchema }),
    query: z.object({
      failures: z.union([z.literal('all'), z.coerce.number().int().min(0).max(1000)]).default(20)
        .describe('how many of the costliest failures to list: 0 to 1000, or "all" (the reports list them all)'),
    }),
    response: z.record(z.string(), z.unknown()),
  }),
  publishSurvey: defineRoute({
    method: 'POST', path: '/api/surveys/{surveyId}/publish', permission: 'report.publish', tag: 'Outcomes',
    summary: 'Publish a survey: its verdicts and figures are frozen with the settings of now. Needs every tested trap decided, or acceptUndecided.',
    params: z.object({ surveyId: idSchema }), body: z.object({ acceptUndecided: z.boolean().default(false) }), response: z.record(z.string(), z.unknown()),
  }),
  siteTrends: defineRoute({
    method: 'GET', path: '/api/sites/{siteId}/trends', permission: 'site.read', tag: 'Outcomes',
    summary: "Every survey of the site side by side: failure rate and losses in total and per area.",
    params: siteParams, response: z.record(z.string(), z.unknown()),
  }),
} as const;

// Routes of later areas live in files of their own and join the one list here.
export const ROUTES = { ...CORE_ROUTES, ...WORK_ORDER_ROUTES, ...REPORT_ROUTES, ...FIELD_NOTE_ROUTES } as const;

export type RouteName = keyof typeof ROUTES;
