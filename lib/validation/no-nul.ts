import { AppError } from '@/lib/http/errors';
import type { FieldIssue } from '@/lib/http/zod-issues';

const MESSAGE = 'Text may not contain the NUL character (\\u0000).';

/**
 * Where request data holds a NUL character, by field path. It is refused wherever it arrives,
 * before any schema: PostgreSQL cannot store it in text at all, and SQLite keeps it while many
 * readers of an export stop at it, so the two databases would not agree on what was saved.
 */
export function nulIssues(value: unknown, path: string[] = []): FieldIssue[] {
  if (typeof value === 'string') return value.includes('\0') ? [{ path: path.join('.'), message: MESSAGE }] : [];
  if (Array.isArray(value)) return value.flatMap((v, i) => nulIssues(v, [...path, String(i)]));
  if (value && typeof value === 'object') {
    return Object.entries(value).flatMap(([k, v]) => [
      ...(k.includes('\0') ? [{ path: [...path, k].join('.'), message: 'A field name may not contain the NUL character (\\u0000).' }] : []),
      ...nulIssues(v, [...path, k]),
    ]);
  }
  return [];
}

/** Refuses request data with a NUL character in it (422, each field named), before any schema reads it. */
export function assertNoNul(value: unknown): void {
  const issues = nulIssues(value);
  if (issues.length) throw new AppError('invalid', 'Text may not contain the NUL character.', issues);
}
