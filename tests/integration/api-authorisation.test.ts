// Every API route × every role × own site / other site / no session, with the exact status.
// Generated from the route list (lib/api/routes.ts): a route without a sample here fails.
import { beforeAll, describe, expect, it } from 'vitest';
import { ROUTES, type RouteName } from '@/lib/api/routes';
import type { RouteSpec } from '@/lib/api/spec';
import { roleMay } from '@/lib/auth/permissions';
import { ROLES, type Role } from '@/lib/domain/vocabulary';
import { demoSites, MODEL_A, newUser, signInAdmin, type SiteIds } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { fixtureFile, METERS, modelAFileFor, multipart, settled, upload } from '../support/uploads';
import fs from 'node:fs';
import path from 'node:path';

import { FIELD_NOTE_SAMPLES } from './samples/field-notes';
import { REPORT_SAMPLES } from './samples/reports';
import type { Sample } from './samples/sample';
import { WORK_ORDER_SAMPLES } from './samples/work-orders';

type Ctx = Parameters<Sample>[1];
type Call = Awaited<ReturnType<Sample>>;

const code = () => `T${Math.random().toString(36).slice(2, 10).toUpperCase()}`.slice(0, 12);
const csv = () => `tag,trap_type,pressure_barg\n${unique('RG')},thermodynamic_disc,8\n`;

const modelADefinition = () => JSON.parse(fs.readFileSync(path.join(METERS, MODEL_A.file), 'utf8'));
const profileIdOf = async (admin: Client) =>
  (await admin.get('/api/instrument-profiles')).body.items.find((p: { name: string }) => p.name === MODEL_A.name).id as number;

const SAMPLES: Record<RouteName, Sample> = {
  ...WORK_ORDER_SAMPLES,
  ...REPORT_SAMPLES,
  ...FIELD_NOTE_SAMPLES,
  me: () => ({ params: {} }),
  listSites: () => ({ params: {} }),
  createSite: () => ({ params: {}, body: { name: unique('Site'), code: code(), timeZone: 'Europe/London', currency: 'EUR', unitSystem: 'si' } }),
  getSite: (s) => ({ params: { siteId: s.siteId } }),
  updateSite: (s) => ({ params: { siteId: s.siteId }, body: { ambientC: 20 } }),
  listAreas: (s) => ({ params: { siteId: s.siteId } }),
  createArea: (s) => ({ params: { siteId: s.siteId }, body: { name: unique('Area') } }),
  updateArea: (s) => ({ params: { areaId: s.areaId }, body: { description: unique('described') } }),
  listTraps: (s) => ({ params: { siteId: s.siteId } }),
  createTrap: (s) => ({ params: { siteId: s.siteId }, body: { tag: unique('TR'), trapType: 'inverted_bucket', pressureBarg: 6 } }),
  getTrap: (s) => ({ params: { trapId: s.trapId } }),
  updateTrap: (s) => ({ params: { trapId: s.trapId }, body: { location: unique('moved') } }),
  previewRegisterImport: (s) => ({ params: { siteId: s.siteId }, body: { csv: csv() } }),
  applyRegisterImport: (s) => ({ params: { siteId: s.siteId }, body: { csv: csv() } }),
  listSurveys: (s) => ({ params: { siteId: s.siteId } }),
  createSurvey: (s) => ({ params: { siteId: s.siteId }, body: { name: unique('Survey'), startsOn: '2027-03-01', endsOn: '2027-03-05' } }),
  listUsers: () => ({ params: {} }),
  createUser: () => ({ params: {}, body: { email: `${unique('u')}@plumeward.example`, name: 'New', role: 'viewer', password: 'long-enough-pass', siteIds: [] } }),
  updateUser: async (_s, { admin }) => {
    const user = await admin.post('/api/users', { email: `${unique('u')}@plumeward.example`, name: 'Target', role: 'viewer', password: 'long-enough-pass', siteIds: [] });
    return { params: { userId: user.body.id }, body: { name: unique('Renamed') } };
  },
  listApiTokens: () => ({ params: {} }),
  createApiToken: (_s, { analystId }) => ({ params: {}, body: { name: unique('script'), userId: analystId } }),
  createUpload: (s) => ({ params: { surveyId: s.surveyId }, body: multipart([fixtureFile('model-a/A_FV-EVP-031_20250408T091403.csv')]) }),
  listUploads: (s) => ({ params: { siteId: s.siteId } }),
  getUpload: (s) => ({ params: { uploadId: s.uploadId } }),
  applyProfileToUpload: async (s, { admin }) => ({ params: { uploadId: s.uploadId }, body: { profileId: await profileIdOf(admin), reprocess: true } }),
  decideUploadTag: async (s, { admin }) => {
    // A fresh tag the register does not know, so there is always one to decide.
    const tag = unique('NEW').toUpperCase();
    const sent = await upload(admin, s.surveyId, [modelAFileFor(tag)]);
    await settled(admin, sent.body.id);
    return { params: { uploadId: sent.body.id }, body: { tag, action: 'ignore' } };
  },
  previewMapping: async (s, { admin }) => {
    const detail = (await admin.get(`/api/uploads/${s.uploadId}`)).body;
    return { params: { uploadId: s.uploadId }, body: { fileId: detail.files[0].id, profile: modelADefinition() } };
  },
  saveMappingDraft: (s) => ({ params: { uploadId: s.uploadId }, body: { fingerprint: 'hf1:draft', step: 'columns', profile: { name: 'draft' } } }),
  listProfiles: () => ({ params: {} }),
  createProfile: () => ({ params: {}, body: { name: unique('Profile'), definition: modelADefinition() } }),
  getProfile: async (_s, { admin }) => ({ params: { profileId: await profileIdOf(admin) } }),
  updateProfile: async (_s, { admin }) => ({ params: { profileId: await profileIdOf(admin) }, body: { definition: { ...modelADefinition(), levelOffsetDb: 0 } } }),
  listTests: (s) => ({ params: { siteId: s.siteId } }),
  // Looked up at call time: re-processing an upload (applyProfileToUpload above) stores its tests anew.
  getTestSeries: async (s, { admin }) => ({ params: { testId: (await admin.get(`/api/sites/${s.siteId}/tests?pageSize=1`)).body.items[0].id } }),
  reviewQueue: (s) => ({ params: { surveyId: s.surveyId } }),
  decideVerdict: async (s, { admin }) => {
    const [test] = (await admin.get(`/api/sites/${s.siteId}/tests?surveyId=${s.surveyId}&role=trap&pageSize=1`)).body.items;
    return { params: { surveyId: test.surveyId }, body: { trapId: test.trapId, action: 'override', testId: test.id, verdict: 'leaking', reason: unique('heard a whistle') } };
  },
  getTest: async (s, { admin }) => ({ params: { testId: (await admin.get(`/api/sites/${s.siteId}/tests?pageSize=1`)).body.items[0].id } }),
  trapHistory: (s) => ({ params: { trapId: s.trapId } }),
  getCostSettings: (s) => ({ params: { siteId: s.siteId } }),
  updateCostSettings: (s) => ({
    params: { siteId: s.siteId },
    body: { operatingHoursPerYear: 8000, steamPricePerTonne: 35, fuelPricePerGj: null, boilerEfficiency: 0.857, feedwaterC: 105, fuel: 'natural_gas', co2KgPerGj: 50.29, co2FactorSource: 'EPA 40 CFR 98 Table C-1', co2FactorYear: 2016 },
  }),
  surveySummary: (s) => ({ params: { surveyId: s.surveyId } }),
  publishSurvey: async (s, { admin }) => {
    // A fresh survey each time: publishing is once only.
    const survey = await admin.post(`/api/sites/${s.siteId}/surveys`, { name: unique('To publish'), startsOn: '2026-10-01', endsOn: '2026-10-02', status: 'in_progress' });
    return { params: { surveyId: survey.body.id ?? s.surveyId }, body: { acceptUndecided: true } };
  },
  siteTrends: (s) => ({ params: { siteId: s.siteId } }),
  revokeApiToken: async (_s, { admin, analystId }) => {
    const token = await admin.post('/api/api-tokens', { name: unique('to-revoke'), userId: analystId });
    return { params: { tokenId: token.body.id } };
  },
};

function url(spec: RouteSpec, params: Record<string, number>) {
  return spec.path.replace(/\{(\w+)\}/g, (_, name: string) => String(params[name]));
}

function call(client: Client, spec: RouteSpec, c: Call) {
  return client.request(spec.method, url(spec, c.params), c.body);
}

const hasSite = (spec: RouteSpec) => /\{(siteId|areaId|trapId|surveyId|uploadId|testId)\}/.test(spec.path);

describe('API authorisation, route by route', () => {
  let ctx: Ctx;
  let sites: { own: SiteIds; other: SiteIds };
  const clients = {} as Record<Role, Client>;

  beforeAll(async () => {
    const admin = await signInAdmin();
    sites = await demoSites(admin);
    clients.admin = admin;
    // Everyone but the admin belongs to the own site only, so the other site must look absent.
    for (const role of ROLES.filter((r) => r !== 'admin')) clients[role] = (await newUser(admin, role, [sites.own.siteId])).client;
    const analyst = await clients.analyst.get('/api/me');
    ctx = { admin, analystId: analyst.body.userId };
  });

  it('has a sample for every route in the route list', () => {
    expect(Object.keys(SAMPLES).sort()).toEqual(Object.keys(ROUTES).sort());
  });

  const entries = Object.entries(ROUTES) as [RouteName, RouteSpec][];

  it.each(entries)('%s: 401 without a session', async (name, spec) => {
    const res = await call(new Client(), spec, await SAMPLES[name](sites.own, ctx));
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  for (const role of ROLES) {
    it.each(entries)(`%s as ${role}: allowed on own site, or 403`, async (name, spec) => {
      const res = await call(clients[role], spec, await SAMPLES[name](sites.own, ctx));
      if (roleMay(role, spec.permission)) {
        expect(res.status, JSON.stringify(res.body)).toBe(spec.status ?? 200);
      } else {
        expect(res.status, JSON.stringify(res.body)).toBe(403);
        expect(res.body.error.code).toBe('forbidden');
      }
    });
  }

  const siteRoutes = entries.filter(([, spec]) => hasSite(spec));
  for (const role of ROLES.filter((r) => r !== 'admin')) {
    it.each(siteRoutes.filter(([, spec]) => roleMay(role, spec.permission)))(
      `%s as ${role}: another site's record answers 404`,
      async (name, spec) => {
        const res = await call(clients[role], spec, await SAMPLES[name](sites.other, ctx));
        expect(res.status, JSON.stringify(res.body)).toBe(404);
        expect(res.body.error.code).toBe('not_found');
      },
    );
  }

  it.each(siteRoutes)('%s as admin: a record that does not exist answers 404', async (name, spec) => {
    const sample = await SAMPLES[name](sites.own, ctx);
    const missing = Object.fromEntries(Object.keys(sample.params).map((k) => [k, 999_999]));
    const res = await call(clients.admin, spec, { ...sample, params: missing });
    expect(res.status).toBe(404);
  });
});
