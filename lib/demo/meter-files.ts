// The demo's meter exports, written as the two invented meter models write them
// (fixtures/meters/model-a and model-b): Fenwick Vale's meter writes "model A" (one
// comma-separated file per test, ISO 8601 UTC, dB, °C, references tagged "-REF"); Saltmarsh's
// writes "model B" (a semicolon day file in Windows-1252 with decimal commas, local day-first
// times, a trap/pipe column, °F). Pure: plans in, bytes out.

import iconv from 'iconv-lite';
import { zoneOffsetMs } from '@/lib/import/time-zone';
import { createRng } from './prng';
import { planSurvey, type DemoSiteCode, type DemoSurveySpec, type DemoTrap, type Placement, type PlannedTest } from './survey-plan';
import { synthesise, type Readings } from './waveforms';

export type MeterModel = 'A' | 'B';
export const METER_OF_SITE: Record<DemoSiteCode, MeterModel> = { FV: 'A', SM: 'B' };
/** Sample rates of the two meters: modest, so the whole demo seeds in seconds. */
export const RATE_HZ: Record<MeterModel, number> = { A: 10, B: 5 };
const AMBIENT_C = 20;

export interface DemoMeterFile {
  name: string;
  bytes: Uint8Array;
  part: PlannedTest['part'];
}

export interface DemoSurveyFiles {
  plan: PlannedTest[];
  files: DemoMeterFile[];
}

interface Rendered {
  planned: PlannedTest;
  trap: Readings;
  reference: Readings | null;
}

function mean(xs: Float64Array): number {
  let s = 0;
  for (const x of xs) s += x;
  return s / xs.length;
}

function render(planned: PlannedTest, rateHz: number): Rendered {
  const spec = (p: Placement) => ({
    waveform: p.waveform, trapType: planned.trap.trapType, durationS: p.durationS, rateHz, tsatC: planned.tsatC, ambientC: AMBIENT_C,
  });
  const trap = synthesise(spec(planned.test), createRng(planned.test.seed));
  const r = planned.reference;
  const reference = r ? synthesise({ ...spec(r), matchDb: mean(trap.levelDb) }, createRng(r.seed)) : null;
  return { planned, trap, reference };
}

const pad = (n: number, w = 2) => String(n).padStart(w, '0');
const utf8 = (text: string) => new TextEncoder().encode(text);

// ---------- model A ----------

function modelAFile(tag: string, startedAt: number, r: Readings, rateHz: number): { name: string; text: string } {
  const lines = ['utc_time,trap_tag,ultrasound_db,surface_temp_c'];
  for (let i = 0; i < r.levelDb.length; i++) {
    const t = new Date(startedAt + Math.round((i * 1000) / rateHz)).toISOString();
    lines.push(`${t},${tag},${r.levelDb[i].toFixed(1)},${r.temperatureC[i].toFixed(1)}`);
  }
  const stamp = new Date(startedAt).toISOString().replace(/[-:]/g, '').slice(0, 15);
  return { name: `A_${tag}_${stamp}.csv`, text: `${lines.join('\n')}\n` };
}

function modelAFiles(rendered: Rendered[]): DemoMeterFile[] {
  const rate = RATE_HZ.A;
  const files: DemoMeterFile[] = [];
  for (const { planned, trap, reference } of rendered) {
    const a = modelAFile(planned.trap.tag, planned.test.startedAt, trap, rate);
    files.push({ name: a.name, bytes: utf8(a.text), part: planned.part });
    if (reference && planned.reference) {
      const b = modelAFile(`${planned.trap.tag}-REF`, planned.reference.startedAt, reference, rate);
      files.push({ name: b.name, bytes: utf8(b.text), part: planned.part });
    }
  }
  return files;
}

// ---------- model B ----------

function wallParts(utcMs: number, zone: string) {
  const d = new Date(utcMs + zoneOffsetMs(zone, utcMs));
  return { y: d.getUTCFullYear(), mo: d.getUTCMonth() + 1, d: d.getUTCDate(), h: d.getUTCHours(), mi: d.getUTCMinutes(), s: d.getUTCSeconds(), ms: d.getUTCMilliseconds() };
}

const dec = (x: number, digits: number) => x.toFixed(digits).replace('.', ',');

function modelBRows(lines: string[], tag: string, point: 'trap' | 'pipe', startedAt: number, r: Readings, zone: string, rateHz: number) {
  // A placement lasts under a minute in daytime, far from a clock change: one offset serves it.
  const offset = zoneOffsetMs(zone, startedAt);
  for (let i = 0; i < r.levelDb.length; i++) {
    const d = new Date(startedAt + offset + Math.round((i * 1000) / rateHz));
    const wall = `${pad(d.getUTCDate())}.${pad(d.getUTCMonth() + 1)}.${d.getUTCFullYear()} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}:${pad(d.getUTCSeconds())},${Math.floor(d.getUTCMilliseconds() / 100)}`;
    const f = (r.temperatureC[i] * 9) / 5 + 32;
    lines.push(`${wall};${tag};${point};${dec(r.levelDb[i], 1)};${dec(f, 1)}`);
  }
}

function modelBFiles(rendered: Rendered[], zone: string): DemoMeterFile[] {
  const rate = RATE_HZ.B;
  const days = new Map<string, Rendered[]>();
  for (const r of rendered) {
    const p = wallParts(r.planned.test.startedAt, zone);
    const key = `${r.planned.part}|${p.y}-${pad(p.mo)}-${pad(p.d)}`;
    days.set(key, [...(days.get(key) ?? []), r]);
  }
  const files: DemoMeterFile[] = [];
  for (const [key, day] of days) {
    const [part, isoDay] = key.split('|') as [PlannedTest['part'], string];
    const last = day[day.length - 1];
    const end = wallParts((last.planned.reference ?? last.planned.test).startedAt + 20 * 60_000, zone);
    const lines = [
      'Unit serial: 0812',
      'Operator: survey team 1',
      `Exported: ${pad(end.d)}.${pad(end.mo)}.${end.y} ${pad(end.h)}:${pad(end.mi)}`,
      'Date/time;Tag;Point;Sound level (dB);Surface (°F)',
    ];
    for (const { planned, trap, reference } of day) {
      modelBRows(lines, planned.trap.tag, 'trap', planned.test.startedAt, trap, zone, rate);
      if (reference && planned.reference) modelBRows(lines, planned.trap.tag, 'pipe', planned.reference.startedAt, reference, zone, rate);
    }
    files.push({ name: `B_${isoDay}.csv`, bytes: new Uint8Array(iconv.encode(`${lines.join('\r\n')}\r\n`, 'windows-1252')), part });
  }
  return files;
}

/** The plan of one demo survey and its meter files, in the site's meter model. Same inputs, same bytes. */
export function demoSurveyFiles(traps: readonly DemoTrap[], spec: DemoSurveySpec): DemoSurveyFiles {
  const plan = planSurvey(traps, spec);
  const model = METER_OF_SITE[spec.site];
  const rendered = plan.map((p) => render(p, RATE_HZ[model]));
  return { plan, files: model === 'A' ? modelAFiles(rendered) : modelBFiles(rendered, spec.timeZone) };
}
