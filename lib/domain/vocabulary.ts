// The fixed word lists of the domain (BRIEF §3, §8). Codes are stored and sent by the API;
// labels are what people read. Pure: safe to import from client components.

export const ROLES = ['admin', 'analyst', 'technician', 'viewer'] as const;
export type Role = (typeof ROLES)[number];
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  analyst: 'Analyst',
  technician: 'Technician',
  viewer: 'Viewer',
};

export const USER_STATUSES = ['active', 'disabled'] as const;
export type UserStatus = (typeof USER_STATUSES)[number];

export const TRAP_TYPES = [
  'thermodynamic_disc',
  'thermostatic_balanced_pressure',
  'thermostatic_bimetallic',
  'float_thermostatic',
  'inverted_bucket',
] as const;
export type TrapType = (typeof TRAP_TYPES)[number];
export const TRAP_TYPE_LABELS: Record<TrapType, string> = {
  thermodynamic_disc: 'Thermodynamic disc',
  thermostatic_balanced_pressure: 'Thermostatic, balanced pressure',
  thermostatic_bimetallic: 'Thermostatic, bimetallic',
  float_thermostatic: 'Float and thermostatic',
  inverted_bucket: 'Inverted bucket',
};

export const APPLICATIONS = ['drip', 'tracer', 'process', 'space_heating'] as const;
export type Application = (typeof APPLICATIONS)[number];
export const APPLICATION_LABELS: Record<Application, string> = {
  drip: 'Drip on main',
  tracer: 'Tracer',
  process: 'Process / heat exchanger',
  space_heating: 'Space heating',
};

export const DISCHARGES_TO = ['return', 'atmosphere'] as const;
export type DischargesTo = (typeof DISCHARGES_TO)[number];
export const DISCHARGES_TO_LABELS: Record<DischargesTo, string> = {
  return: 'Condensate return',
  atmosphere: 'Atmosphere',
};

export const CRITICALITIES = ['low', 'normal', 'high'] as const;
export type Criticality = (typeof CRITICALITIES)[number];
export const CRITICALITY_LABELS: Record<Criticality, string> = { low: 'Low', normal: 'Normal', high: 'High' };

export const TRAP_STATUSES = ['in_service', 'out_of_service', 'removed'] as const;
export type TrapStatus = (typeof TRAP_STATUSES)[number];
export const TRAP_STATUS_LABELS: Record<TrapStatus, string> = {
  in_service: 'In service',
  out_of_service: 'Out of service',
  removed: 'Removed',
};

export const SURVEY_STATUSES = ['planned', 'in_progress', 'published'] as const;
export type SurveyStatus = (typeof SURVEY_STATUSES)[number];
export const SURVEY_STATUS_LABELS: Record<SurveyStatus, string> = {
  planned: 'Planned',
  in_progress: 'In progress',
  published: 'Published',
};

export const UNIT_SYSTEMS = ['si', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = { si: 'SI (kg, °C, bar)', us: 'US customary (lb, °F, psi)' };

// Uploads and their files (BRIEF §3).
export const UPLOAD_STATUSES = ['received', 'queued', 'processing', 'waiting_for_mapping', 'done', 'failed'] as const;
export type UploadStatus = (typeof UPLOAD_STATUSES)[number];
export const UPLOAD_STATUS_LABELS: Record<UploadStatus, string> = {
  received: 'Received',
  queued: 'Queued',
  processing: 'Processing',
  waiting_for_mapping: 'Waiting for a column mapping',
  done: 'Done',
  failed: 'Failed',
};

export const SOURCE_FILE_KINDS = ['file', 'zip', 'entry'] as const;
export type SourceFileKind = (typeof SOURCE_FILE_KINDS)[number];

export const SOURCE_FILE_STATUSES = ['pending', 'needs_mapping', 'processed', 'failed', 'duplicate', 'skipped', 'unpacked'] as const;
export type SourceFileStatus = (typeof SOURCE_FILE_STATUSES)[number];
export const SOURCE_FILE_STATUS_LABELS: Record<SourceFileStatus, string> = {
  pending: 'Waiting',
  needs_mapping: 'Needs a column mapping',
  processed: 'Imported',
  failed: 'Not imported',
  duplicate: 'Already uploaded',
  skipped: 'Skipped',
  unpacked: 'Unpacked',
};

export const TEST_ROLES = ['trap', 'reference'] as const;
export type TestRole = (typeof TEST_ROLES)[number];

/** Whether a test's tag found its trap in the register. */
export const MATCH_STATUSES = ['matched', 'unmatched', 'ignored'] as const;
export type MatchStatus = (typeof MATCH_STATUSES)[number];
