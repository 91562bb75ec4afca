// Survey reports over HTTP on the seeded demo: the files parsed back (PDF text, spreadsheet
// cells, CSV records) against the survey's own figures from the API; a formula-looking area name
// made through the API comes out neutralised; another site's report does not exist for a viewer.
import ExcelJS from 'exceljs';
import { beforeAll, describe, expect, it } from 'vitest';
import { kgToLb, tonnesToKlb } from '@/lib/analysis/units';
import { demoSites, newUser, signInAdmin, type SiteIds } from '../support/fixtures';
import { baseUrl, Client, unique } from '../support/http';
import { modelAFileFor, settled, upload } from '../support/uploads';
import { csvRecords, en, readPdf, readWorkbook as workbook, sheetRecords as records } from '../lib/reports/read-report';

const pdfText = async (bytes: Uint8Array) => (await readPdf(bytes)).map((p) => p.text);

type Figures = {
  total: { registered: number; tested: number; failed: number; failureRate: number | null; lossKgPerHour: number; lossTonnesPerYear: number; costPerYear: number | null };
  byArea: { areaName: string; tested: number; failed: number }[];
  failures: { tag: string; areaName: string | null; kgPerHour: number; costPerYear: number | null }[];
};

/** A report's bytes, fetched with a bearer token (the JSON client reads bodies as text). */
async function download(secret: string, path: string) {
  const res = await fetch(baseUrl() + path, { headers: { authorization: `Bearer ${secret}` } });
  return { status: res.status, headers: res.headers, bytes: new Uint8Array(await res.arrayBuffer()) };
}

describe('survey reports', () => {
  let admin: Client;
  let sites: { own: SiteIds; other: SiteIds };
  let viewer: { id: number; client: Client; secret: string };
  let site: { id: number; code: string; currency: string; unitSystem: 'si' | 'us'; timeZone: string };
  let published: { id: number; name: string; publishedAt: string };

  beforeAll(async () => {
    admin = await signInAdmin();
    sites = await demoSites(admin);
    const user = await newUser(admin, 'viewer', [sites.own.siteId]);
    const token = await admin.post('/api/api-tokens', { name: unique('reports'), userId: user.id });
    expect(token.status, JSON.stringify(token.body)).toBe(201);
    viewer = { id: user.id, client: user.client, secret: token.body.secret };
    site = (await admin.get(`/api/sites/${sites.own.siteId}`)).body;
    const surveys = (await admin.get(`/api/sites/${site.id}/surveys`)).body.items as { id: number; name: string; status: string; publishedAt: string }[];
    // The demo's own published spring survey (other tests publish surveys of their own).
    published = surveys.find((s) => s.status === 'published' && s.name.startsWith('Spring'))!;
    expect(published, 'the demo has a published survey').toBeDefined();
  });

  const flow = (kg: number) => (site.unitSystem === 'us' ? kgToLb(kg) : kg);
  const annual = (t: number) => (site.unitSystem === 'us' ? tonnesToKlb(t) : t);
  const flowUnit = () => (site.unitSystem === 'us' ? 'lb/h' : 'kg/h');
  const publishedOn = () => new Intl.DateTimeFormat('en-CA', { timeZone: site.timeZone }).format(new Date(published.publishedAt));

  it('serves a published survey as a PDF whose text carries its frozen figures and date on every page', async () => {
    const summary = (await admin.get(`/api/surveys/${published.id}/summary`)).body as { frozen: boolean; figures: Figures };
    expect(summary.frozen).toBe(true);
    const res = await download(viewer.secret, `/api/surveys/${published.id}/report?format=pdf`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe(
      `attachment; filename="plumeward-${site.code.toLowerCase()}-${published.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}-published-${publishedOn()}.pdf"`,
    );
    const pages = await pdfText(res.bytes);
    const all = pages.join(' ');
    const t = summary.figures.total;
    expect(all).toContain(published.name);
    expect(all).toContain(`${t.tested} of ${t.registered}`);
    expect(all).toContain(`${en((t.failed / t.tested) * 100, 1)} %`);
    expect(all).toContain(`${en(flow(t.lossKgPerHour), 1)} ${flowUnit()}`);
    if (t.costPerYear !== null) expect(all).toContain(`${en(t.costPerYear, 0)} ${site.currency}`);
    const top = summary.figures.failures[0];
    expect(top, 'the published demo survey has failures to list').toBeDefined();
    expect(all).toContain(`1 ${top.tag} `);
    expect(all).toContain('docs/verdict-table.md');
    pages.forEach((p, i) => {
      expect(p).toContain(`Published ${publishedOn()}`);
      expect(p).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  });

  it('serves the same frozen figures as a spreadsheet and a CSV', async () => {
    const { figures } = (await admin.get(`/api/surveys/${published.id}/summary?failures=all`)).body as { figures: Figures };
    const xlsx = await download(viewer.secret, `/api/surveys/${published.id}/report?format=xlsx`);
    expect(xlsx.status).toBe(200);
    expect(xlsx.headers.get('content-type')).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    const wb = await workbook(xlsx.bytes);
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Summary', 'By area', 'Failures', 'Trends', 'Method']);
    for (const ws of wb.worksheets) expect(String(ws.getCell('A2').value)).toContain(`Published ${publishedOn()}`);
    const summary = Object.fromEntries(records(wb.getWorksheet('Summary')!).map((r) => [r['Figure'].value, r['Value'].value]));
    expect(summary['Tested']).toBe(figures.total.tested);
    expect(summary['Failed']).toBe(figures.total.failed);
    expect(summary['Failure rate']).toBeCloseTo(figures.total.failureRate!, 12);
    expect(summary[`Steam lost (${flowUnit()})`]).toBeCloseTo(flow(figures.total.lossKgPerHour), 9);
    expect(summary[`Steam lost (${site.unitSystem === 'us' ? 'klb/yr' : 't/yr'})`]).toBeCloseTo(annual(figures.total.lossTonnesPerYear), 9);
    const failures = records(wb.getWorksheet('Failures')!);
    expect(failures.map((r) => r['Tag'].value)).toEqual(figures.failures.map((f) => f.tag));
    failures.forEach((r, i) => {
      expect(r[`Steam lost (${flowUnit()})`].type).toBe(ExcelJS.ValueType.Number);
      expect(r[`Steam lost (${flowUnit()})`].value).toBeCloseTo(flow(figures.failures[i].kgPerHour), 9);
    });
    expect(records(wb.getWorksheet('By area')!).map((r) => r['Area'].value)).toEqual(figures.byArea.map((a) => a.areaName));

    const csv = await download(viewer.secret, `/api/surveys/${published.id}/report?format=csv`);
    expect(csv.headers.get('content-type')).toBe('text/csv; charset=utf-8; header=present');
    const rows = csvRecords(csv.bytes).data;
    expect(rows.map((r) => r['Tag'])).toEqual(figures.failures.map((f) => f.tag));
    rows.forEach((r, i) => expect(r[`Steam lost (${flowUnit()})`]).toBeCloseTo(flow(figures.failures[i].kgPerHour), 2));
  });

  it('neutralises an area name that reads as a formula, made through the API, in every export', async () => {
    const areaName = `=1+2 ${unique('reports')}`;
    const area = await admin.post(`/api/sites/${site.id}/areas`, { name: areaName });
    expect(area.status, JSON.stringify(area.body)).toBe(201);
    const tag = unique('FV-RPT').toUpperCase();
    const trap = await admin.post(`/api/sites/${site.id}/traps`, { tag, areaId: area.body.id, trapType: 'thermodynamic_disc', pressureBarg: 8, sizeDn: 15 });
    expect(trap.status, JSON.stringify(trap.body)).toBe(201);
    // A test of the new trap in the survey in progress, overridden to leaking: a failure with a loss.
    const surveyId = sites.own.surveyId;
    const sent = await upload(admin, surveyId, [modelAFileFor(tag)]);
    const done = await settled(admin, sent.body.id);
    const [test] = (await admin.get(`/api/sites/${site.id}/tests?uploadId=${done.id}&role=trap`)).body.items;
    expect(test?.trapId).toBe(trap.body.id);
    const decided = await admin.post(`/api/surveys/${surveyId}/verdicts`, { trapId: trap.body.id, action: 'override', testId: test.id, verdict: 'leaking', reason: 'report export test' });
    expect(decided.status, JSON.stringify(decided.body)).toBe(200);

    const csv = csvRecords((await download(viewer.secret, `/api/surveys/${surveyId}/report?format=csv`)).bytes).data;
    const row = csv.find((r) => r['Tag'] === tag)!;
    expect(row, 'the new failure is in the CSV').toBeDefined();
    expect(row['Area']).toBe(`'${areaName}`);
    expect(row['Status']).toBe('Draft — figures follow the current settings');
    expect(typeof row[`Steam lost (${flowUnit()})`]).toBe('number');
    const byArea = csvRecords((await download(viewer.secret, `/api/surveys/${surveyId}/report?format=csv&table=areas`)).bytes).data;
    expect(byArea.map((r) => r['Area'])).toContain(`'${areaName}`);

    const wb = await workbook((await download(viewer.secret, `/api/surveys/${surveyId}/report?format=xlsx`)).bytes);
    for (const ws of wb.worksheets) expect(ws.getCell('A2').value).toBe('Draft — figures follow the current settings');
    const cell = records(wb.getWorksheet('Failures')!).find((r) => r['Tag'].value === tag)!['Area'];
    expect(cell.type).toBe(ExcelJS.ValueType.String);
    expect(cell.value).toBe(`'${areaName}`);
    wb.eachSheet((ws) => ws.eachRow((r) => r.eachCell((c) => expect(c.type).not.toBe(ExcelJS.ValueType.Formula))));

    const pages = await pdfText((await download(viewer.secret, `/api/surveys/${surveyId}/report?format=pdf`)).bytes);
    for (const p of pages) expect(p).toContain('Draft — figures follow the current settings');
  });

  it("answers 404 for another site's report, and 422 for an unknown format", async () => {
    const other = await viewer.client.get(`/api/surveys/${sites.other.surveyId}/report?format=pdf`);
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe('not_found');
    expect((await download(viewer.secret, `/api/surveys/${sites.other.surveyId}/report?format=xlsx`)).status).toBe(404);
    const own = await viewer.client.get(`/api/surveys/${sites.own.surveyId}/report?format=docx`);
    expect(own.status).toBe(422);
  });
});
