// The families the decision table reasons about, over the trap types of the domain
// vocabulary (the register CSV's codes, BRIEF §3). Family membership follows BRIEF §3:
// disc, inverted bucket and thermostatic traps cycle; float traps modulate.

import { TRAP_TYPES, type TrapType } from '../domain/vocabulary';

export { TRAP_TYPES, type TrapType };

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
