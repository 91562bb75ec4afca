import type { z } from 'zod';
import type { Permission } from '@/lib/auth/permissions';

/** What a route is: its place, who may call it, and the shapes it takes and gives (for the OpenAPI document). */
export type RouteSpec = {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** OpenAPI-style path, e.g. /api/sites/{siteId}/traps. Must match the route file's folder. */
  path: string;
  permission: Permission;
  summary: string;
  tag: string;
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
  response?: z.ZodType;
  status?: number;
};

export const defineRoute = <S extends RouteSpec>(spec: S) => spec;
