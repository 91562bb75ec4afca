import 'server-only';
import type { ParamOverrides } from '@/lib/analysis/defaults';
import type { InstrumentProfile as ProfileDefinition } from '@/lib/import/instrument-profile';
import { costOverrides } from '@/lib/outcomes/cost-params';
import { getCostSettings } from '@/lib/services/outcomes';
import type { Site } from '@/models';

/**
 * The analysis parameters of one import: the site's ambient temperature and cost settings, and
 * the instrument profile's calibrated band limits (BRIEF §4a precedence: trap type < profile < site).
 * They are recorded with each test's figures, so a re-run is reproducible.
 */
export async function analysisParamsFor(site: Site, profile: ProfileDefinition | null): Promise<ParamOverrides> {
  const settings = await getCostSettings(site.id);
  return {
    ...costOverrides(settings),
    temperature: { ambientC: site.ambientC },
    bands: { profile: profile?.bands ?? null },
  };
}
