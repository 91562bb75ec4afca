// One sample call of a route for the authorisation matrix: params (and a body) that succeed for
// a role allowed on the site of `ids`, made with the admin's help where a record is needed first.
import type { SiteIds } from '../../support/fixtures';
import type { Client } from '../../support/http';

export type SampleContext = { admin: Client; analystId: number };
export type SampleCall = { params: Record<string, number>; body?: unknown };
export type Sample = (ids: SiteIds, ctx: SampleContext) => Promise<SampleCall> | SampleCall;
