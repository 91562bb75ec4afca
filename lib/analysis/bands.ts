// The three level regions: quiet band (closed, no flow), condensate band, live-steam
// band. Limits resolve with the precedence of BRIEF §4a: trap-type default <
// instrument profile < site override; each limit remembers which layer set it.

import type { AnalysisParams, BandLimits } from './defaults';
import { cellWidthS, durationS, type Timebase } from './timebase';
import type { TrapType } from './trap-types';

export type BandSource = 'trap_type_default' | 'instrument_profile' | 'site_override';

export interface ResolvedBands extends BandLimits {
  source: Record<keyof BandLimits, BandSource>;
}

export interface BandShares {
  quiet: number;
  condensate: number;
  liveSteam: number;
}

export function resolveBands(trapType: TrapType | null, p: AnalysisParams['bands']): ResolvedBands {
  const base = p.byTrapType[trapType ?? 'unknown'];
  const out: ResolvedBands = {
    quietMaxDb: base.quietMaxDb,
    liveSteamMinDb: base.liveSteamMinDb,
    source: { quietMaxDb: 'trap_type_default', liveSteamMinDb: 'trap_type_default' },
  };
  const layers: Array<[Partial<BandLimits> | null, BandSource]> = [
    [p.profile, 'instrument_profile'],
    [p.site, 'site_override'],
  ];
  for (const [layer, source] of layers) {
    for (const key of ['quietMaxDb', 'liveSteamMinDb'] as const) {
      const value = layer?.[key];
      if (typeof value === 'number' && Number.isFinite(value)) {
        out[key] = value;
        out.source[key] = source;
      }
    }
  }
  if (!(out.quietMaxDb < out.liveSteamMinDb)) {
    throw new RangeError(`quiet band (≤ ${out.quietMaxDb} dB) must lie below the live-steam band (≥ ${out.liveSteamMinDb} dB)`);
  }
  return out;
}

/** Share of test time in each band (quiet ≤ quietMax; live steam ≥ liveSteamMin; condensate between). */
export function bandShares(level: Float32Array, tb: Timebase, bands: BandLimits): BandShares {
  const n = level.length;
  const q = bands.quietMaxDb;
  const l = bands.liveSteamMinDb;
  let quiet = 0;
  let live = 0;
  if (tb.kind === 'regular') {
    for (let i = 0; i < n; i++) {
      const v = level[i];
      if (v <= q) quiet++;
      else if (v >= l) live++;
    }
    return { quiet: quiet / n, liveSteam: live / n, condensate: (n - quiet - live) / n };
  }
  for (let i = 0; i < n; i++) {
    const v = level[i];
    const w = cellWidthS(tb, n, i);
    if (v <= q) quiet += w;
    else if (v >= l) live += w;
  }
  const total = durationS(tb, n);
  return { quiet: quiet / total, liveSteam: live / total, condensate: (total - quiet - live) / total };
}
