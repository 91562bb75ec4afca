import 'server-only';
import type { z } from 'zod';
import { actorFromRequest, type Actor } from '@/lib/auth/actor';
import { assertPermission, assertSiteAccess } from '@/lib/auth/guard';
import type { RouteSpec } from '@/lib/api/spec';
import type { DataVersion } from '@/lib/services/derived-cache';
import { AppError, toErrorBody } from './errors';
import { assertNoNul } from '@/lib/validation/no-nul';
import { keptReply } from './kept-replies';
import { fieldIssues } from './zod-issues';

type Out<T> = T extends z.ZodType ? z.output<T> : undefined;

export type RouteContext<S extends RouteSpec> = {
  actor: Actor;
  params: Out<S['params']>;
  query: Out<S['query']>;
  body: S['body'] extends z.ZodType ? z.output<S['body']> : undefined;
  /** The site the record belongs to, already checked against the actor; null for routes without one. */
  siteId: number | null;
  request: Request;
};

type SiteResolver<S extends RouteSpec> = (input: {
  params: Out<S['params']>;
  query: Out<S['query']>;
}) => Promise<number | null | undefined> | number | null | undefined;

/** The version of the data a GET's reply is made from, when the reply may be kept; null: make it afresh. */
type KeepVersion<S extends RouteSpec> = (input: { params: Out<S['params']>; query: Out<S['query']> }) => Promise<DataVersion | null>;

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

// A cookie-authenticated write must come from our own pages: browsers send Origin on every
// cross-site POST, so a foreign Origin is a forged form or script, and "null" (a sandboxed frame,
// a redirect across sites) names no page of ours. Sec-Fetch-Site is sent by every current browser
// and cannot be set by a page's script: "cross-site" or "same-site" (a sibling host, which gets our
// cookies too) is refused even where Origin was stripped. Bearer tokens are not ambient: scripts
// with a token send neither header and are not checked.
const FOREIGN_FETCH_SITES = new Set(['cross-site', 'same-site']);

function assertSameOrigin(request: Request, actor: Actor) {
  if (actor.via !== 'session' || !WRITE_METHODS.has(request.method)) return;
  const refused = new AppError('forbidden', 'Cross-site request refused.');
  if (FOREIGN_FETCH_SITES.has(request.headers.get('sec-fetch-site') ?? '')) throw refused;
  const origin = request.headers.get('origin');
  if (!origin) return;
  const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host');
  if (!URL.canParse(origin) || new URL(origin).host !== host) throw refused;
}

function parseOr<T extends z.ZodType>(schema: T, value: unknown, onError: (e: z.ZodError) => AppError): z.output<T> {
  const result = schema.safeParse(value);
  if (!result.success) throw onError(result.error);
  return result.data;
}

async function readJson(request: Request): Promise<unknown> {
  const text = await request.text();
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('invalid', 'The request body is not valid JSON.');
  }
}

/**
 * The one wrapper every API route handler goes through:
 * authenticate (401) → role and token scope (403) → record's site (404) → validate (422) → handle.
 *
 * `keep` lets a GET's reply be kept and sent again while the data under it stands
 * (lib/http/kept-replies.ts); such a reply must depend on its parameters, query and that data
 * alone — never on who asks, who is checked above all the same. A client that has the reply
 * already (If-None-Match) gets 304.
 */
export function apiRoute<S extends RouteSpec>(
  spec: S,
  impl: { site?: SiteResolver<S>; keep?: KeepVersion<S>; handle: (ctx: RouteContext<S>) => Promise<unknown> },
) {
  return async (request: Request, context: { params: Promise<Record<string, string>> }): Promise<Response> => {
    try {
      const actor = await actorFromRequest(request);
      if (!actor) {
        throw new AppError('unauthenticated', 'Sign in, or send an API token as "Authorization: Bearer <token>".');
      }
      assertPermission(actor, spec.permission);
      assertSameOrigin(request, actor);
      // A malformed id in the path names no record: 404, like a missing one.
      const params = (spec.params
        ? parseOr(spec.params, await context.params, () => new AppError('not_found', 'No such record.'))
        : undefined) as Out<S['params']>;
      const searchParams = Object.fromEntries(new URL(request.url).searchParams);
      assertNoNul(searchParams);
      const query = (spec.query
        ? parseOr(spec.query, searchParams, (e) => new AppError('invalid', 'Invalid query parameters.', fieldIssues(e)))
        : undefined) as Out<S['query']>;
      const siteId = impl.site ? await assertSiteAccess(actor, await impl.site({ params, query })) : null;
      const json = spec.body ? await readJson(request) : undefined;
      assertNoNul(json);
      const body = (spec.body
        ? parseOr(spec.body, json, (e) => new AppError('invalid', 'Invalid request body.', fieldIssues(e)))
        : undefined) as RouteContext<S>['body'];
      const ctx = { actor, params, query, body, siteId, request };
      const version = impl.keep && request.method === 'GET' ? await impl.keep({ params, query }) : null;
      if (version !== null) {
        const reply = await keptReply(`${spec.method} ${spec.path} ${JSON.stringify([params, query])}`, version, async () => {
          const result = await impl.handle(ctx);
          if (result instanceof Response) throw new Error(`${spec.path}: a kept reply must be data, not a Response`);
          return result;
        });
        const headers = { 'content-type': 'application/json', etag: reply.etag, 'cache-control': 'private, no-cache' };
        if (request.headers.get('if-none-match') === reply.etag) return new Response(null, { status: 304, headers });
        return new Response(reply.text, { status: spec.status ?? 200, headers });
      }
      const result = await impl.handle(ctx);
      if (result instanceof Response) return result;
      return Response.json(result, { status: spec.status ?? 200 });
    } catch (err) {
      const { status, body } = toErrorBody(err);
      return Response.json(body, { status });
    }
  };
}
