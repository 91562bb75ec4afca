// The API's route list: every route handler under app/api takes its spec from here, and the
// OpenAPI document and the route tests are generated from it. A route not listed here does not exist.
import { z } from 'zod';
import { ROLES, SURVEY_STATUSES, TRAP_TYPES, UNIT_SYSTEMS, USER_STATUSES } from '@/lib/domain/vocabulary';
import { apiTokenInputSchema } from '@/lib/validation/api-token';
import { areaInputSchema } from '@/lib/validation/area';
import { idSchema } from '@/lib/validation/common';
import { siteInputSchema, siteUpdateSchema } from '@/lib/validation/site';
import { surveyInputSchema } from '@/lib/validation/survey';
import { trapInputSchema, trapListQuerySchema, trapUpdateSchema } from '@/lib/validation/trap';
import { userInputSchema, userUpdateSchema } from '@/lib/validation/user';
import { defineRoute } from './spec';

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

export const ROUTES = {
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
} as const;

export type RouteName = keyof typeof ROUTES;
