// A register shaped like the demo's (seeders/demo-scenario.ts: areas, tag codes, type and
// pressure mixes), built here without a database so the generator can be tried as a unit.
import type { DemoTrap } from '@/lib/demo/survey-plan';
import { createRng } from '@/lib/demo/prng';
import { DEMO_AREAS } from '@/seeders/demo-scenario';

export function demoLikeRegister(seed = 20260401): DemoTrap[] {
  const rng = createRng(seed);
  return DEMO_AREAS.flatMap((area) =>
    Array.from({ length: area.count }, (_, i): DemoTrap => ({
      tag: `${area.tagCode}-${String(area.firstNumber + i).padStart(3, '0')}`,
      site: area.site,
      area: area.name,
      trapType: rng.weighted(area.types),
      application: rng.weighted(area.applications),
      pressureBarg: rng.pick(area.pressures),
      status: rng.weighted([['in_service', 95], ['out_of_service', 4], ['removed', 1]] as const),
    })),
  );
}
