// Part of the route list (lib/api/routes.ts joins it in).
import type { RouteSpec } from './spec';

export const WORK_ORDER_ROUTES = {} as const satisfies Record<string, RouteSpec>;
