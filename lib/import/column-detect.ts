import { nameScores, roleOfWord, wordsOf } from './header-vocabulary';
import { COMMA, DOT, parseDecimal } from './number-parse';
import { createCursor, parseDateOnly, parseDateTime, parseTimeOnly, type DateOrder } from './time-parse';
import type { LevelUnit, TemperatureUnit } from './units';

/**
 * What each column holds, read from its header name (and units row) and its
 * values. Values win over names where they disagree: a column named "time"
 * holding 0, 0.05, 0.1 … is elapsed seconds, not a clock time.
 */

export type ColumnKind =
  | 'datetime'
  | 'date'
  | 'time-of-day'
  | 'epoch'
  | 'elapsed'
  | 'index'
  | 'level'
  | 'temperature'
  | 'tag'
  | 'role'
  | 'number'
  | 'text'
  | 'empty';

export interface DetectedColumn {
  index: number;
  name: string;
  /** Unit text from the units row, when the file has one. */
  unitText: string | null;
  kind: ColumnKind;
  /** 0..1: how sure detection is of `kind`. */
  confidence: number;
  /** Why, in plain words (shown in the wizard). */
  reason: string;
  dateOrder?: DateOrder;
  /** The times name their own offset (`Z`, `+01:00`). */
  zoneInText?: boolean;
  epochUnit?: 's' | 'ms';
  elapsedUnit?: 's' | 'ms';
  levelUnit?: LevelUnit;
  temperatureUnit?: TemperatureUnit;
  /** Share of sampled values that fit `kind`. */
  valueShare: number;
  min?: number;
  max?: number;
  distinct: string[];
}

function levelUnitOf(words: string[]): LevelUnit | null {
  const w = new Set(words);
  if (w.has('dbuv') || w.has('dbµv') || (w.has('db') && (w.has('uv') || w.has('µv')))) return 'dBuV';
  if (w.has('mv') || w.has('mvrms') || w.has('millivolt') || w.has('millivolts')) return 'mV';
  if (w.has('v') || w.has('vrms') || w.has('volt') || w.has('volts')) return 'V';
  if (w.has('db')) return 'dB';
  return null;
}

function temperatureUnitOf(words: string[], raw: string): TemperatureUnit | null {
  const w = new Set(words);
  if (w.has('°f') || w.has('degf') || w.has('fahrenheit') || w.has('f') || /°\s*f\b/i.test(raw)) return 'F';
  if (w.has('°c') || w.has('degc') || w.has('celsius') || w.has('c') || /°\s*c\b/i.test(raw)) return 'C';
  if (w.has('k') || w.has('kelvin')) return 'K';
  return null;
}

function share(n: number, of: number): number {
  return of === 0 ? 0 : n / of;
}

interface ValueStats {
  n: number;
  numeric: number;
  integers: number;
  nums: number[];
  datetime: Record<DateOrder, number>;
  zoned: number;
  dateOnly: Record<DateOrder, number>;
  timeOnly: number;
  role: number;
  taglike: number;
  distinct: Set<string>;
}

function valueStats(values: string[], decimalMark: '.' | ','): ValueStats {
  const cur = createCursor();
  const mark = decimalMark === ',' ? COMMA : DOT;
  const st: ValueStats = {
    n: 0, numeric: 0, integers: 0, nums: [], zoned: 0, timeOnly: 0, role: 0, taglike: 0,
    datetime: { ymd: 0, dmy: 0, mdy: 0 },
    dateOnly: { ymd: 0, dmy: 0, mdy: 0 },
    distinct: new Set(),
  };
  for (const v of values) {
    if (!v) continue;
    st.n++;
    if (st.distinct.size < 50) st.distinct.add(v);
    const x = parseDecimal(v, 0, v.length, mark);
    if (x === x) {
      st.numeric++;
      st.nums.push(x);
      if (Number.isInteger(x) && !v.includes(decimalMark)) st.integers++;
      continue;
    }
    for (const o of ['ymd', 'dmy', 'mdy'] as const) {
      if (!Number.isNaN(parseDateTime(v, 0, v.length, o, cur))) {
        st.datetime[o]++;
        if (o === 'ymd' && !Number.isNaN(cur.zoneOffsetMs)) st.zoned++;
      }
      if (!Number.isNaN(parseDateOnly(v, 0, v.length, o, cur))) st.dateOnly[o]++;
    }
    if (!Number.isNaN(parseTimeOnly(v, 0, v.length, cur))) st.timeOnly++;
    if (roleOfWord(v)) st.role++;
    if (/^[\p{L}][\p{L}\d]*(?:[-_./ ]?[\p{L}\d]+)*$/u.test(v.trim()) && /\d/.test(v) && v.length <= 40) st.taglike++;
  }
  return st;
}

function bestOrder(counts: Record<DateOrder, number>): { order: DateOrder; count: number; ambiguous: boolean } {
  const orders: DateOrder[] = ['ymd', 'dmy', 'mdy'];
  let best: DateOrder = 'ymd';
  for (const o of orders) if (counts[o] > counts[best]) best = o;
  const ambiguous = best !== 'ymd' && counts.dmy === counts.mdy;
  if (ambiguous) {
    // Day and month both ≤ 12 everywhere: a dot separator is the day-first
    // convention of the languages we read; otherwise day-first stays a guess.
    best = 'dmy';
  }
  return { order: best, count: counts[best], ambiguous };
}

/** Growing at least 90 % of the way: a clock reset or a repeated time does not hide an epoch column. */
function mostlyIncreasing(nums: number[]): boolean {
  let up = 0;
  for (let i = 1; i < nums.length; i++) if (nums[i] >= nums[i - 1]) up++;
  return nums.length > 1 && up >= 0.9 * (nums.length - 1);
}

function isNonDecreasing(nums: number[]): boolean {
  for (let i = 1; i < nums.length; i++) if (nums[i] < nums[i - 1]) return false;
  return nums.length > 1;
}

function stepsOfOne(nums: number[]): boolean {
  for (let i = 1; i < nums.length; i++) if (nums[i] - nums[i - 1] !== 1) return false;
  return nums.length > 1;
}

export function detectColumn(index: number, name: string, unitText: string | null, values: string[], decimalMark: '.' | ','): DetectedColumn {
  const fullName = unitText ? `${name} ${unitText}` : name;
  const words = wordsOf(fullName);
  const scores = nameScores(name);
  const st = valueStats(values, decimalMark);
  const base = { index, name, unitText, distinct: [...st.distinct].slice(0, 20) };
  if (st.n === 0) return { ...base, kind: 'empty', confidence: 1, reason: 'no values in the sampled rows', valueShare: 0 };

  const dt = bestOrder(st.datetime);
  if (share(dt.count, st.n) >= 0.8) {
    const c = (dt.ambiguous ? 0.5 : 0.95) * share(dt.count, st.n);
    const dotted = values.some((v) => /^\s*\d{1,2}\.\d{1,2}\.\d{4}/.test(v));
    return {
      ...base,
      kind: 'datetime',
      dateOrder: dt.order,
      zoneInText: st.zoned >= dt.count * 0.8,
      confidence: dt.ambiguous && dotted ? Math.max(c, 0.8) : c,
      reason: dt.ambiguous
        ? `dates where day and month are both 12 or less: read as day-first${dotted ? ' (dotted dates are day-first)' : ', please check'}`
        : `${Math.round(share(dt.count, st.n) * 100)} % of the values are ${dt.order} dates with times`,
      valueShare: share(dt.count, st.n),
    };
  }
  const dOnly = bestOrder(st.dateOnly);
  if (share(dOnly.count, st.n) >= 0.8) {
    return { ...base, kind: 'date', dateOrder: dOnly.order, confidence: dOnly.ambiguous ? 0.5 : 0.9, reason: 'dates without times (a time column should go with it)', valueShare: share(dOnly.count, st.n) };
  }
  if (share(st.timeOnly, st.n) >= 0.8) {
    return { ...base, kind: 'time-of-day', confidence: 0.9, reason: 'times of day without dates', valueShare: share(st.timeOnly, st.n) };
  }
  if (share(st.numeric, st.n) >= 0.8) {
    const nums = st.nums;
    let min = Infinity;
    let max = -Infinity;
    for (const x of nums) {
      if (x < min) min = x;
      if (x > max) max = x;
    }
    const num = { ...base, min, max, valueShare: share(st.numeric, st.n) };
    if (min >= 1e9 && max < 5e9 && mostlyIncreasing(nums)) return { ...num, kind: 'epoch', epochUnit: 's', confidence: 0.85, reason: 'numbers near 1.7 billion that grow: seconds since 1970' };
    if (min >= 1e12 && max < 5e12 && mostlyIncreasing(nums)) return { ...num, kind: 'epoch', epochUnit: 'ms', confidence: 0.85, reason: 'numbers near 1.7 trillion that grow: milliseconds since 1970' };
    if (isNonDecreasing(nums) && min >= 0 && (scores.time > 0 || scores.index > 0)) {
      if (scores.index > scores.time || (scores.time === 0 && stepsOfOne(nums))) return { ...num, kind: 'index', confidence: 0.8, reason: 'sample numbers counting up by one' };
      return { ...num, kind: 'elapsed', elapsedUnit: words.includes('ms') ? 'ms' : 's', confidence: 0.8, reason: 'times counting up from the start' };
    }
    const lu = levelUnitOf(words);
    const tu = temperatureUnitOf(words, fullName);
    if (scores.level > scores.temperature || (lu && !tu && scores.temperature === 0)) {
      return {
        ...num,
        kind: 'level',
        levelUnit: lu ?? 'dB',
        confidence: lu ? 0.9 : 0.6,
        reason: lu ? `a level in ${lu}` : 'a level; no unit in the header, read as dB',
      };
    }
    if (scores.temperature > 0 || tu) {
      const unit: TemperatureUnit = tu ?? (min > 200 ? 'K' : 'C');
      return {
        ...num,
        kind: 'temperature',
        temperatureUnit: unit,
        confidence: tu ? 0.9 : 0.5,
        reason: tu ? `a temperature in ${unit === 'K' ? 'kelvin' : `°${unit}`}` : `a temperature; no unit in the header, read as ${unit === 'K' ? 'kelvin' : '°C'} from the values`,
      };
    }
    if (isNonDecreasing(nums) && stepsOfOne(nums)) return { ...num, kind: 'index', confidence: 0.5, reason: 'numbers counting up by one' };
    return { ...num, kind: 'number', confidence: 0.3, reason: 'numbers with a name Plumeward does not know' };
  }
  if (share(st.role, st.n) >= 0.8 && st.distinct.size <= 6) {
    return { ...base, kind: 'role', confidence: scores.role > 0 ? 0.9 : 0.6, reason: `point roles (${[...st.distinct].join(', ')})`, valueShare: share(st.role, st.n) };
  }
  if (scores.tag > 0 || share(st.taglike, st.n) >= 0.8) {
    return { ...base, kind: 'tag', confidence: scores.tag > 0 && share(st.taglike, st.n) >= 0.5 ? 0.9 : 0.6, reason: 'trap tags', valueShare: share(st.taglike, st.n) };
  }
  return { ...base, kind: 'text', confidence: 0.3, reason: 'text with a name Plumeward does not know', valueShare: 1 };
}
