// Trap types as the register CSV spells them (BRIEF §3), and the families the
// decision table reasons about. Family membership follows BRIEF §3: disc,
// inverted bucket and thermostatic traps cycle; float traps modulate.

export const TRAP_TYPES = [
  'thermodynamic_disc',
  'thermostatic_balanced_pressure',
  'thermostatic_bimetallic',
  'float_thermostatic',
  'inverted_bucket',
] as const;

export type TrapType = (typeof TRAP_TYPES)[number];

export function isTrapType(value: unknown): value is TrapType {
  return typeof value === 'string' && (TRAP_TYPES as readonly string[]).includes(value);
}

export function isCyclingType(type: TrapType): boolean {
  return type !== 'float_thermostatic';
}

export function isThermostatic(type: TrapType): boolean {
  return type === 'thermostatic_balanced_pressure' || type === 'thermostatic_bimetallic';
}

/** Words used in reasons shown to the analyst. */
export const TRAP_TYPE_WORDS: Record<TrapType, string> = {
  thermodynamic_disc: 'thermodynamic disc trap',
  thermostatic_balanced_pressure: 'balanced-pressure thermostatic trap',
  thermostatic_bimetallic: 'bimetallic thermostatic trap',
  float_thermostatic: 'float and thermostatic trap',
  inverted_bucket: 'inverted bucket trap',
};
