import type { Area, Site, Survey, Trap, User } from '@/models';

// Plain objects for pages and the API: never hand a model instance to a component.

export function siteDto(site: Site) {
  return {
    id: site.id, name: site.name, code: site.code, timeZone: site.timeZone,
    currency: site.currency, unitSystem: site.unitSystem, ambientC: site.ambientC,
  };
}
export type SiteDto = ReturnType<typeof siteDto>;

export function areaDto(area: Area) {
  return { id: area.id, siteId: area.siteId, name: area.name, description: area.description ?? null };
}
export type AreaDto = ReturnType<typeof areaDto>;

export function trapDto(trap: Trap) {
  return {
    id: trap.id, siteId: trap.siteId, tag: trap.tag, areaId: trap.areaId ?? null,
    areaName: trap.area?.name ?? null, location: trap.location ?? null, trapType: trap.trapType,
    application: trap.application ?? null, sizeDn: trap.sizeDn ?? null, orificeMm: trap.orificeMm ?? null,
    pressureBarg: trap.pressureBarg, dischargesTo: trap.dischargesTo, criticality: trap.criticality,
    status: trap.status, updatedAt: trap.updatedAt.toISOString(),
  };
}
export type TrapDto = ReturnType<typeof trapDto>;

export function surveyDto(survey: Survey) {
  return {
    id: survey.id, siteId: survey.siteId, name: survey.name, startsOn: survey.startsOn, endsOn: survey.endsOn,
    status: survey.status, publishedAt: survey.publishedAt ? survey.publishedAt.toISOString() : null,
  };
}
export type SurveyDto = ReturnType<typeof surveyDto>;

export function userDto(user: User, siteIds: number[]) {
  return {
    id: user.id, email: user.email, name: user.name, role: user.role, status: user.status,
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null, siteIds,
  };
}
export type UserDto = ReturnType<typeof userDto>;
