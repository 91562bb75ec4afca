// The invented demo scenario of BRIEF §2: two fictional sites, their areas and traps, and one
// user per role. Everything here is made up; no real plant, company or person.
import type { Application, Criticality, DischargesTo, TrapType } from '@/lib/domain/vocabulary';

export const DEMO_PASSWORDS = {
  admin: 'demo-admin-pass',
  analyst: 'demo-analyst-pass',
  technician: 'demo-technician-pass',
  viewer: 'demo-viewer-pass',
} as const;

export const DEMO_USERS = [
  { email: 'admin@plumeward.example', name: 'Demo Admin', role: 'admin', sites: ['FV', 'SM'] },
  { email: 'analyst@plumeward.example', name: 'Demo Analyst', role: 'analyst', sites: ['FV', 'SM'] },
  { email: 'technician@plumeward.example', name: 'Demo Technician', role: 'technician', sites: ['FV'] },
  { email: 'viewer@plumeward.example', name: 'Demo Viewer', role: 'viewer', sites: ['FV'] },
] as const;

/** A token for the demo analyst, printed in the README so scripts can be tried at once. Demo only. */
export const DEMO_ANALYST_TOKEN = 'pwt_demo-analyst-local-scripts-only';

export const DEMO_SITES = [
  { code: 'FV', name: 'Fenwick Vale Creamery', timeZone: 'Europe/London', currency: 'GBP', unitSystem: 'si' },
  { code: 'SM', name: 'Saltmarsh Terminal', timeZone: 'Europe/Amsterdam', currency: 'EUR', unitSystem: 'si' },
] as const;

type Mix<T extends string> = readonly (readonly [T, number])[];

export type DemoArea = {
  site: 'FV' | 'SM';
  name: string;
  /** Tag prefix and first number, e.g. FV-EVP-001. */
  tagCode: string;
  firstNumber: number;
  count: number;
  pressures: readonly number[];
  types: Mix<TrapType>;
  applications: Mix<Application>;
  sizes: readonly number[];
  atmosphereShare: number;
  criticality: Criticality;
  places: readonly string[];
};

export const DEMO_AREAS: readonly DemoArea[] = [
  {
    site: 'FV', name: 'Boiler House', tagCode: 'FV-BLR', firstNumber: 1, count: 22, pressures: [12, 12, 10],
    types: [['thermodynamic_disc', 5], ['inverted_bucket', 4], ['float_thermostatic', 1]],
    applications: [['drip', 8], ['process', 2]], sizes: [15, 20, 25], atmosphereShare: 0.1, criticality: 'high',
    places: ['header drop leg', 'steam main drip pocket', 'deaerator inlet', 'blowdown vessel', 'feed pump set'],
  },
  {
    site: 'FV', name: 'Evaporator Hall', tagCode: 'FV-EVP', firstNumber: 1, count: 48, pressures: [8, 8, 6],
    types: [['float_thermostatic', 5], ['thermodynamic_disc', 3], ['inverted_bucket', 2]],
    applications: [['process', 6], ['drip', 4]], sizes: [20, 25, 40, 50], atmosphereShare: 0.05, criticality: 'normal',
    places: ['calandria effect 1', 'calandria effect 2', 'preheater', 'thermocompressor line', 'mezzanine main'],
  },
  {
    site: 'FV', name: 'Spray Dryer', tagCode: 'FV-SPD', firstNumber: 1, count: 40, pressures: [10, 10, 8],
    types: [['float_thermostatic', 4], ['thermodynamic_disc', 3], ['inverted_bucket', 2]],
    applications: [['process', 5], ['drip', 4]], sizes: [15, 20, 25, 40], atmosphereShare: 0.05, criticality: 'normal',
    places: ['air heater bank', 'main air heater coil', 'tower ring main', 'fluid bed heater', 'roof main'],
  },
  {
    site: 'FV', name: 'CIP Kitchen', tagCode: 'FV-CIP', firstNumber: 1, count: 30, pressures: [4, 3, 3],
    types: [['float_thermostatic', 3], ['thermostatic_balanced_pressure', 3], ['thermodynamic_disc', 1]],
    applications: [['process', 5], ['space_heating', 2], ['drip', 1]], sizes: [15, 20, 25], atmosphereShare: 0.1, criticality: 'normal',
    places: ['caustic tank heater', 'acid tank heater', 'hot water set', 'unit heater', 'return header'],
  },
  {
    site: 'FV', name: 'Tank Farm Tracing', tagCode: 'FV-TFT', firstNumber: 1, count: 40, pressures: [3, 3, 4],
    types: [['thermostatic_bimetallic', 4], ['thermostatic_balanced_pressure', 3], ['thermodynamic_disc', 2]],
    applications: [['tracer', 8], ['drip', 1]], sizes: [15, 15, 20], atmosphereShare: 0.35, criticality: 'low',
    places: ['cream silo line', 'whey tank line', 'fat tank line', 'pipe bridge', 'tanker bay line'],
  },
  {
    site: 'SM', name: 'Tank Heating', tagCode: 'SM-TKH', firstNumber: 1, count: 20, pressures: [6, 8],
    types: [['float_thermostatic', 3], ['inverted_bucket', 2]],
    applications: [['process', 4], ['drip', 1]], sizes: [25, 40, 50], atmosphereShare: 0.05, criticality: 'high',
    places: ['tank 3 floor coil', 'tank 4 floor coil', 'tank 7 suction heater', 'tank 9 floor coil', 'heater manifold'],
  },
  {
    site: 'SM', name: 'Line Tracing', tagCode: 'SM-TRC', firstNumber: 101, count: 30, pressures: [4, 5, 6],
    types: [['thermostatic_bimetallic', 3], ['thermodynamic_disc', 3], ['thermostatic_balanced_pressure', 1]],
    applications: [['tracer', 9], ['drip', 1]], sizes: [15, 15, 20], atmosphereShare: 0.4, criticality: 'normal',
    places: ['jetty line', 'loading rack header', 'pipe rack north', 'pipe rack south', 'manifold pit'],
  },
  {
    site: 'SM', name: 'Boiler House', tagCode: 'SM-BLR', firstNumber: 1, count: 10, pressures: [8, 8, 6],
    types: [['thermodynamic_disc', 3], ['inverted_bucket', 2]],
    applications: [['drip', 4], ['process', 1]], sizes: [15, 20, 25], atmosphereShare: 0.1, criticality: 'high',
    places: ['steam header', 'fuel oil heater', 'deaerator', 'boiler 1 outlet', 'boiler 2 outlet'],
  },
];

export const ATMOSPHERE: DischargesTo = 'atmosphere';
