/**
 * Local wall-clock times to UTC in an IANA zone, with Intl only (no tz
 * package). Offsets are cached per zone and per 15 minutes of wall time: every
 * zone's transitions fall on quarter-hour wall times, and rows of a test are
 * sequential, so the reader calls Intl about once per quarter hour of data.
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** True when Intl knows the zone name. */
export function isKnownTimeZone(zone: string): boolean {
  try {
    formatterFor(zone);
    return true;
  } catch {
    return false;
  }
}

/** The zone's offset from UTC (ms, east positive) at a UTC instant. */
export function zoneOffsetMs(zone: string, utcMs: number): number {
  if (zone === 'UTC' || zone === 'Etc/UTC') return 0;
  const parts = formatterFor(zone).formatToParts(new Date(Math.floor(utcMs / 1000) * 1000));
  let y = 0, mo = 0, d = 0, h = 0, mi = 0, s = 0;
  for (const p of parts) {
    switch (p.type) {
      case 'year': y = +p.value; break;
      case 'month': mo = +p.value; break;
      case 'day': d = +p.value; break;
      case 'hour': h = +p.value; break;
      case 'minute': mi = +p.value; break;
      case 'second': s = +p.value; break;
    }
  }
  const asUtc = Date.UTC(y, mo - 1, d, h, mi, s);
  return asUtc - Math.floor(utcMs / 1000) * 1000;
}

/**
 * Wall time (ms, as if the wall clock were UTC) → UTC ms.
 * A wall time that happens twice (clocks going back) resolves to the first
 * occurrence; one that never happens (clocks going forward) is moved forward
 * by the gap — the same choice as Temporal's "compatible" disambiguation.
 */
export function wallToUtc(wallMs: number, zone: string): number {
  if (zone === 'UTC' || zone === 'Etc/UTC') return wallMs;
  // The offsets a day either side bracket any transition near this wall time.
  const before = zoneOffsetMs(zone, wallMs - 86_400_000);
  const after = zoneOffsetMs(zone, wallMs + 86_400_000);
  if (before === after) {
    const o = zoneOffsetMs(zone, wallMs - before);
    if (o === before) return wallMs - before;
  }
  const early = wallMs - before; // reading the wall time with the earlier offset
  const late = wallMs - after;
  const earlyOk = zoneOffsetMs(zone, early) === before;
  const lateOk = zoneOffsetMs(zone, late) === after;
  if (earlyOk && lateOk) return Math.min(early, late); // repeated hour: first occurrence
  if (earlyOk) return early;
  if (lateOk) return late;
  // Skipped hour: the wall time is read with the offset from before the jump.
  return wallMs - before;
}

const QUARTER_HOUR = 900_000;

/** A converter that caches the offset of the last quarter hour it saw. */
export function createWallToUtc(zone: string): (wallMs: number) => number {
  if (zone === 'UTC' || zone === 'Etc/UTC') return (w) => w;
  let bucket = NaN;
  let offset = 0;
  return (wallMs) => {
    const b = Math.floor(wallMs / QUARTER_HOUR);
    if (b !== bucket) {
      bucket = b;
      const start = b * QUARTER_HOUR;
      offset = start - wallToUtc(start, zone);
    }
    return wallMs - offset;
  };
}
