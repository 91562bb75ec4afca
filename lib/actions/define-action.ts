import 'server-only';
import type { z } from 'zod';
import { actorFromSession, type Actor } from '@/lib/auth/actor';
import { assertPermission, assertSiteAccess } from '@/lib/auth/guard';
import type { Permission } from '@/lib/auth/permissions';
import { AppError, toErrorBody, type ErrorBody } from '@/lib/http/errors';
import { fieldIssues } from '@/lib/http/zod-issues';
import { assertNoNul } from '@/lib/validation/no-nul';

export type ActionResult<T> = { ok: true; data: T } | ({ ok: false } & ErrorBody);

type ActionSpec<S extends z.ZodType> = {
  /** Unique name, listed in ACTION_REGISTRY for the authorisation tests. */
  name: string;
  permission: Permission;
  input: S;
  /** The site the record belongs to; omit for actions that concern no site (users, tokens). */
  site?: (input: z.output<S>) => Promise<number | null | undefined> | number | null | undefined;
};

/** Every server action, by name: the authorisation tests walk this list. */
export const ACTION_REGISTRY = new Map<string, { permission: Permission; hasSite: boolean; action: (raw: unknown) => Promise<unknown> }>();

/**
 * The one wrapper every server action goes through, in the same order as API routes:
 * session (401) → role (403) → validate (422) → record's site (404) → run.
 * Results are plain objects (never thrown), so forms can show field errors.
 */
export function defineAction<S extends z.ZodType, T>(
  spec: ActionSpec<S>,
  run: (ctx: { actor: Actor; input: z.output<S>; siteId: number | null }) => Promise<T>,
): (raw: unknown) => Promise<ActionResult<T>> {
  const action = async (raw: unknown): Promise<ActionResult<T>> => {
    try {
      const actor = await actorFromSession();
      if (!actor) throw new AppError('unauthenticated', 'Your session has ended. Sign in again.');
      assertPermission(actor, spec.permission);
      assertNoNul(raw);
      const parsed = spec.input.safeParse(raw);
      if (!parsed.success) throw new AppError('invalid', 'Some fields need attention.', fieldIssues(parsed.error));
      const siteId = spec.site ? await assertSiteAccess(actor, await spec.site(parsed.data)) : null;
      return { ok: true, data: await run({ actor, input: parsed.data, siteId }) };
    } catch (err) {
      return { ok: false, ...toErrorBody(err).body };
    }
  };
  // The function itself too: the tests match the build's exported actions to these entries by identity.
  ACTION_REGISTRY.set(spec.name, { permission: spec.permission, hasSite: !!spec.site, action });
  return action;
}
