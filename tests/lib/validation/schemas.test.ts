// The zod schemas shared by forms, the API and the register import.
import { describe, expect, it } from 'vitest';
import { apiTokenInputSchema } from '@/lib/validation/api-token';
import { siteInputSchema } from '@/lib/validation/site';
import { surveyInputSchema } from '@/lib/validation/survey';
import { trapInputSchema, trapListQuerySchema } from '@/lib/validation/trap';
import { userInputSchema } from '@/lib/validation/user';

const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join('.')).sort();

describe('trap input', () => {
  it('fills defaults and turns blanks into null', () => {
    const r = trapInputSchema.parse({ tag: ' FV-EVP-031 ', trapType: 'inverted_bucket', pressureBarg: 8, location: '' });
    expect(r).toEqual({
      tag: 'FV-EVP-031', areaId: null, location: null, trapType: 'inverted_bucket', application: null, sizeDn: null,
      orificeMm: null, pressureBarg: 8, dischargesTo: 'return', criticality: 'normal', status: 'in_service',
    });
  });

  it.each([
    [{ tag: '', trapType: 'inverted_bucket', pressureBarg: 8 }, ['tag']],
    [{ tag: '=HYPERLINK("x")', trapType: 'inverted_bucket', pressureBarg: 8 }, ['tag']],
    [{ tag: 'A1', trapType: 'bucket', pressureBarg: 8 }, ['trapType']],
    [{ tag: 'A1', trapType: 'float_thermostatic' }, ['pressureBarg']],
    [{ tag: 'A1', trapType: 'float_thermostatic', pressureBarg: 101 }, ['pressureBarg']],
    [{ tag: 'A1', trapType: 'float_thermostatic', pressureBarg: 3, sizeDn: 15.5, orificeMm: 0 }, ['orificeMm', 'sizeDn']],
    [{ tag: 'A1', trapType: 'float_thermostatic', pressureBarg: 3, status: 'gone' }, ['status']],
  ])('refuses %j at %j', (input, expected) => {
    expect(paths(trapInputSchema.safeParse(input))).toEqual(expected);
  });

  it('says "required" when the pressure is missing and "number" when it is not one', () => {
    const missing = trapInputSchema.safeParse({ tag: 'A1', trapType: 'float_thermostatic' });
    const text = trapInputSchema.safeParse({ tag: 'A1', trapType: 'float_thermostatic', pressureBarg: 'high' });
    expect(missing.error?.issues[0].message).toBe('Line pressure (barg) is required.');
    expect(text.error?.issues[0].message).toBe('Line pressure (barg) must be a number.');
  });
});

describe('register list query', () => {
  it('coerces strings from the URL and applies defaults', () => {
    expect(trapListQuerySchema.parse({ page: '3', areaId: '7' })).toMatchObject({ page: 3, pageSize: 50, sort: 'tag', dir: 'asc', areaId: 7 });
  });
  it('caps the page size', () => {
    expect(trapListQuerySchema.safeParse({ pageSize: '501' }).success).toBe(false);
  });
});

describe('site, survey, user and token input', () => {
  it('knows IANA zones and ISO currencies', () => {
    const ok = siteInputSchema.safeParse({ name: 'X', code: 'ab', timeZone: 'Europe/Dublin', currency: 'eur', unitSystem: 'si' });
    expect(ok.success && ok.data).toMatchObject({ code: 'AB', currency: 'EUR', ambientC: 20 });
    expect(paths(siteInputSchema.safeParse({ name: 'X', code: 'A', timeZone: 'Mars/Olympus', currency: 'EURO', unitSystem: 'metric' })))
      .toEqual(['code', 'currency', 'timeZone', 'unitSystem']);
  });
  it('refuses a survey that ends before it starts', () => {
    expect(paths(surveyInputSchema.safeParse({ name: 'S', startsOn: '2027-04-10', endsOn: '2027-04-01' }))).toEqual(['endsOn']);
  });
  it('lower-cases e-mails and wants a 10-character password', () => {
    expect(userInputSchema.parse({ email: 'A@B.example', name: 'n', role: 'viewer', password: '0123456789' }).email).toBe('a@b.example');
    expect(paths(userInputSchema.safeParse({ email: 'nope', name: 'n', role: 'boss', password: 'short' }))).toEqual(['email', 'password', 'role']);
  });
  it('treats an empty site list on a token as "all the owner\'s sites"', () => {
    expect(apiTokenInputSchema.parse({ name: 't', userId: 1, siteIds: [] }).siteIds).toBeNull();
    expect(apiTokenInputSchema.parse({ name: 't', userId: 1, siteIds: [2] }).siteIds).toEqual([2]);
  });
});
