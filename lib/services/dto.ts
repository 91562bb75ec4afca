import type {
  Application, Criticality, DischargesTo, Role, SurveyStatus, TrapStatus, TrapType, UnitSystem, UserStatus,
} from '@/lib/domain/vocabulary';
import type { Area, Site, Survey, Trap, User } from '@/models';

// Plain objects for pages and the API: never hand a model instance to a component.

export type SiteDto = {
  id: number; name: string; code: string; timeZone: string; currency: string; unitSystem: UnitSystem; ambientC: number;
};
export function siteDto(site: Site): SiteDto {
  return {
    id: site.id, name: site.name, code: site.code, timeZone: site.timeZone,
    currency: site.currency, unitSystem: site.unitSystem, ambientC: site.ambientC,
  };
}

export function areaDto(area: Area) {
  return { id: area.id, siteId: area.siteId, name: area.name, description: area.description ?? null };
}
export type AreaDto = ReturnType<typeof areaDto>;

export type TrapDto = {
  id: number; siteId: number; tag: string; areaId: number | null; areaName: string | null; location: string | null;
  trapType: TrapType; application: Application | null; sizeDn: number | null; orificeMm: number | null;
  pressureBarg: number; dischargesTo: DischargesTo; criticality: Criticality; status: TrapStatus; updatedAt: string;
};
export function trapDto(trap: Trap): TrapDto {
  return {
    id: trap.id, siteId: trap.siteId, tag: trap.tag, areaId: trap.areaId ?? null,
    areaName: trap.area?.name ?? null, location: trap.location ?? null, trapType: trap.trapType,
    application: trap.application ?? null, sizeDn: trap.sizeDn ?? null, orificeMm: trap.orificeMm ?? null,
    pressureBarg: trap.pressureBarg, dischargesTo: trap.dischargesTo, criticality: trap.criticality,
    status: trap.status, updatedAt: trap.updatedAt.toISOString(),
  };
}

export type SurveyDto = {
  id: number; siteId: number; name: string; startsOn: string; endsOn: string; status: SurveyStatus; publishedAt: string | null;
};
export function surveyDto(survey: Survey): SurveyDto {
  return {
    id: survey.id, siteId: survey.siteId, name: survey.name, startsOn: survey.startsOn, endsOn: survey.endsOn,
    status: survey.status, publishedAt: survey.publishedAt ? survey.publishedAt.toISOString() : null,
  };
}

export type UserDto = {
  id: number; email: string; name: string; role: Role; status: UserStatus; lastSignInAt: string | null; siteIds: number[];
};
export function userDto(user: User, siteIds: number[]): UserDto {
  return {
    id: user.id, email: user.email, name: user.name, role: user.role, status: user.status,
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null, siteIds,
  };
}
