// Part of the route list (lib/api/routes.ts joins it in).
import type { RouteSpec } from './spec';

export const FIELD_NOTE_ROUTES = {} as const satisfies Record<string, RouteSpec>;
