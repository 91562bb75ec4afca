// Reference check (BRIEF §4 item 5): compare the trap's mean level with the mean of
// a test on the adjacent pipe. When the trap is not clearly louder, the sound may be
// carried from elsewhere (valves, pumps, a neighbouring trap); common practice, no
// primary source (see shared/references/trade-references.md §7).

export interface ReferenceCheck {
  available: boolean;
  referenceMeanDb: number | null;
  /** Trap mean − reference mean, dB. */
  differenceDb: number | null;
  marginDb: number;
  /** True when the trap is at least marginDb louder; null without a reference test. */
  clearlyLouder: boolean | null;
}

export function checkReference(trapMeanDb: number, referenceMeanDb: number | null | undefined, marginDb: number): ReferenceCheck {
  if (referenceMeanDb === null || referenceMeanDb === undefined || !Number.isFinite(referenceMeanDb)) {
    return { available: false, referenceMeanDb: null, differenceDb: null, marginDb, clearlyLouder: null };
  }
  const differenceDb = trapMeanDb - referenceMeanDb;
  return { available: true, referenceMeanDb, differenceDb, marginDb, clearlyLouder: differenceDb >= marginDb };
}
