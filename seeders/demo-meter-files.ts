// The demo's meter exports, from the seeded register and surveys: the files the seed imports
// (seeders/20261201000400-demo-tests.ts) and the day of files still to come in the survey in
// progress, which `writeDemoDayFiles` writes for the demo to upload by hand.
import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import { demoSurveyFiles, type DemoMeterFile } from '@/lib/demo/meter-files';
import type { DemoSiteCode, DemoTrap, SurveyPhase } from '@/lib/demo/survey-plan';
import { Area, Site, Survey, Trap } from '@/models';
import { DEMO_SITES } from './demo-scenario';

export interface DemoSurveyOnDisk {
  site: Site;
  survey: Survey;
  phase: SurveyPhase;
}

/** The demo sites' surveys with their place in the story: the two springs by date, then the one in progress. */
export async function demoSurveys(): Promise<DemoSurveyOnDisk[]> {
  const sites = await Site.findAll({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } }, order: [['code', 'ASC']] });
  const out: DemoSurveyOnDisk[] = [];
  for (const site of sites) {
    const surveys = await Survey.findAll({ where: { siteId: site.id }, order: [['startsOn', 'ASC']] });
    const published = surveys.filter((s) => s.status === 'published').slice(-2);
    const current = surveys.find((s) => s.status === 'in_progress');
    if (published.length === 2) {
      out.push({ site, survey: published[0], phase: 'first_spring' }, { site, survey: published[1], phase: 'second_spring' });
    }
    if (current) out.push({ site, survey: current, phase: 'in_progress' });
  }
  return out;
}

export async function demoTraps(site: Site): Promise<DemoTrap[]> {
  const areas = new Map((await Area.findAll({ where: { siteId: site.id }, order: [['id', 'ASC']] })).map((a) => [a.id, a.name]));
  const order = [...areas.keys()];
  const traps = await Trap.findAll({ where: { siteId: site.id } });
  // Area order as created (the scenario's order), so the surveyor's walk follows the plant.
  traps.sort((a, b) => order.indexOf(a.areaId ?? -1) - order.indexOf(b.areaId ?? -1) || a.tag.localeCompare(b.tag));
  return traps.map((t) => ({
    tag: t.tag, site: site.code as DemoSiteCode, area: (t.areaId && areas.get(t.areaId)) || 'unassigned',
    trapType: t.trapType, application: t.application ?? null, pressureBarg: t.pressureBarg, status: t.status,
  }));
}

export async function filesOfSurvey(s: DemoSurveyOnDisk): Promise<DemoMeterFile[]> {
  return demoSurveyFiles(await demoTraps(s.site), {
    site: s.site.code as DemoSiteCode, phase: s.phase, startsOn: s.survey.startsOn, timeZone: s.site.timeZone,
  }).files;
}

/**
 * Writes the meter files of the traps the survey in progress has not reached yet — what the
 * surveyors bring back next — one folder per site (`<dir>/<site code>/…`). Needs the seeded
 * database. Returns the paths written.
 */
export async function writeDemoDayFiles(dir: string): Promise<string[]> {
  const written: string[] = [];
  for (const s of await demoSurveys()) {
    if (s.phase !== 'in_progress') continue;
    const folder = path.join(dir, s.site.code);
    fs.mkdirSync(folder, { recursive: true });
    for (const f of (await filesOfSurvey(s)).filter((file) => file.part === 'remaining')) {
      const target = path.join(folder, f.name);
      fs.writeFileSync(target, f.bytes);
      written.push(target);
    }
  }
  return written;
}
