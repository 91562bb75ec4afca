import type { LayoutDetection } from '@/lib/import/detect-layout';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';

export const WIZARD_STEPS = [
  { step: 'format', label: 'File format' },
  { step: 'columns', label: 'Columns and units' },
  { step: 'save', label: 'Save the profile' },
] as const;
export type WizardStep = (typeof WIZARD_STEPS)[number]['step'];

/** What a wizard step loads from the server: the layout's detection and the saved draft. */
export type WizardState = {
  siteId: number;
  uploadId: number;
  siteTimeZone: string;
  fingerprint: string;
  /** Null once a profile reads this layout (the wizard is done, or a colleague finished it). */
  layout: { fileIds: number[]; fileNames: string[]; detection: LayoutDetection | null } | null;
  draft: { step: string; profile: InstrumentProfile; updatedBy: string; updatedAt: string } | null;
};

// Tags in a file name such as A_FV-EVP-031_….csv: letters, then dash-separated groups.
const TAG_IN_NAME = '(?<tag>[A-Za-z]{1,6}(?:-[A-Za-z0-9]+){1,4})';

/**
 * The profile the wizard starts from: the saved draft, else what detection suggests, else a
 * skeleton of the detected format for the analyst to complete.
 */
export function startingProfile(detection: LayoutDetection | null, fingerprint: string, draft: InstrumentProfile | null): InstrumentProfile {
  if (draft) return { ...draft, fingerprint };
  if (detection?.suggestedProfile) return { ...detection.suggestedProfile, name: '', fingerprint };
  const levelColumn = detection?.columns.find((c) => c.kind === 'level')?.index ?? Math.min(1, Math.max(0, (detection?.columns.length ?? 1) - 1));
  return {
    format: 'plumeward.instrument-profile',
    version: 1,
    name: '',
    description: '',
    encoding: detection?.encoding?.encoding ?? 'auto',
    delimiter: detection?.delimiter ?? ',',
    decimalMark: detection?.decimalMark ?? '.',
    preambleKeys: detection?.preamble.entries.map((e) => e.key) ?? [],
    header: detection?.header ?? [],
    unitsRow: detection?.unitsRow !== null && detection?.unitsRow !== undefined,
    time: { kind: 'datetime', column: 0, timeColumn: null, order: 'ymd', zone: null },
    level: { column: levelColumn, unit: 'dB', vrefV: 1e-6 },
    temperature: null,
    tag: { from: 'file-name', pattern: TAG_IN_NAME },
    role: { from: 'none' },
    referenceLink: { by: 'same-tag' },
    levelOffsetDb: 0,
    bands: null,
    split: { minGapS: 5, gapPeriods: 10 },
    fingerprint,
  };
}

export type ColumnOption = { index: number; label: string };

export function columnOptions(detection: LayoutDetection | null, profile: InstrumentProfile): ColumnOption[] {
  const width = Math.max(profile.header.length, detection?.columns.length ?? 0, 1);
  return Array.from({ length: width }, (_, i) => {
    const name = profile.header[i] || detection?.columns[i]?.name || '';
    return { index: i, label: `${i + 1} · ${name || '(no name)'}` };
  });
}

/** 0.83 → "83 %" */
export const percent = (v: number) => `${Math.round(v * 100)} %`;
