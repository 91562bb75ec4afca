// One sample argument per server action (by its defineAction name) for the action matrix: an input
// that succeeds for a role allowed on the site of `ids`, made with the admin's help where a record
// is needed first. tests/integration/action-authorisation.test.ts fails for an action without one.
import { unique } from '../../support/http';
import type { SiteIds } from '../../support/fixtures';
import type { SampleContext } from './sample';

export type ActionSample = (ids: SiteIds, ctx: SampleContext) => Promise<Record<string, unknown>> | Record<string, unknown>;

/** A site code no other call has used: 2–12 upper-case letters and digits. */
const siteCode = () => `X${Date.now().toString(36).slice(-5)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();

const newViewer = async ({ admin }: SampleContext) => {
  const user = await admin.post('/api/users', { email: `${unique('target')}@plumeward.example`, name: 'Target', role: 'viewer', password: 'long-enough-pass', siteIds: [] });
  if (user.status !== 201) throw new Error(`user: ${user.status} ${JSON.stringify(user.body)}`);
  return user.body.id as number;
};

export const ACTION_SAMPLES: Record<string, ActionSample> = {
  createSite: () => ({ name: unique('Site'), code: siteCode(), timeZone: 'Europe/London', currency: 'EUR', unitSystem: 'si', ambientC: 20 }),
  createUser: () => ({ email: `${unique('u')}@plumeward.example`, name: 'New', role: 'viewer', password: 'long-enough-pass', siteIds: [] }),
  updateUser: async (_s, ctx) => ({ userId: await newViewer(ctx), user: { name: unique('Renamed') } }),
  createApiToken: (_s, { analystId }) => ({ name: unique('script'), userId: analystId }),
  revokeApiToken: async (_s, { admin, analystId }) => {
    const token = await admin.post('/api/api-tokens', { name: unique('to-revoke'), userId: analystId });
    if (token.status !== 201) throw new Error(`token: ${token.status} ${JSON.stringify(token.body)}`);
    return { tokenId: token.body.id };
  },
  createTrap: (s) => ({ siteId: s.siteId, trap: { tag: unique('TR'), trapType: 'inverted_bucket', pressureBarg: 6 } }),
  updateTrap: (s) => ({ trapId: s.trapId, trap: { location: unique('moved') } }),
  createArea: (s) => ({ siteId: s.siteId, area: { name: unique('Area') } }),
  updateArea: async (s, { admin }) => {
    // The form sends the whole area: keep the demo area's name, change its description.
    const areas = (await admin.get(`/api/sites/${s.siteId}/areas`)).body.items as { id: number; name: string }[];
    const area = areas.find((a) => a.id === s.areaId)!;
    return { areaId: area.id, area: { name: area.name, description: unique('described') } };
  },
  createSurvey: (s) => ({ siteId: s.siteId, survey: { name: unique('Survey'), startsOn: '2027-03-01', endsOn: '2027-03-05' } }),
};
