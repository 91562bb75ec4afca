import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/db';

/**
 * How long the newest stamp under a result must be past before the result is kept. Rows carry
 * the writer's clock, stamped before their transaction commits: two writes in one millisecond
 * carry the same stamp, and instances sharing a PostgreSQL database have clocks slightly apart.
 * A result is kept only once its data has been quiet for longer than any of these; until then
 * each request computes afresh.
 */
export const SETTLE_MS = 2000;

/** What a survey's derived figures were computed from, as the database says now. */
export type DataVersion = { key: string; settled: boolean };

type VersionRow = Record<'test_writes' | 'verdicts_n' | 'traps_n' | 'areas_n', number | string | null>
  & Record<'verdicts_at' | 'traps_at' | 'areas_at', Date | string | null>;

const stamp = (v: Date | string | null) => (v === null ? 0 : new Date(v).getTime());

/**
 * The version of everything a survey's queue and figures read: its tests and decisions, and its
 * site's traps and areas, read from the database on every request, so a write through any
 * instance shows at once. Its tests by the database's own count of writes to them
 * (migrations/20261201100100-count-test-writes.ts); decisions, traps and areas, a few thousand rows
 * at most, by their count (a row removed) and newest stamp (a row added or changed), each from an
 * index. Who decided is read with each page instead (a user's row changes at every sign-in).
 */
export async function surveyDataVersion(surveyId: number): Promise<DataVersion> {
  const site = '(SELECT site_id FROM surveys WHERE id = :surveyId)';
  const [row] = await sequelize.query<VersionRow>(
    `SELECT
      (SELECT writes FROM survey_test_writes WHERE survey_id = :surveyId) AS test_writes,
      (SELECT COUNT(*) FROM trap_verdicts WHERE survey_id = :surveyId) AS verdicts_n,
      (SELECT MAX(updated_at) FROM trap_verdicts WHERE survey_id = :surveyId) AS verdicts_at,
      (SELECT COUNT(*) FROM traps WHERE site_id = ${site}) AS traps_n,
      (SELECT MAX(updated_at) FROM traps WHERE site_id = ${site}) AS traps_at,
      (SELECT COUNT(*) FROM areas WHERE site_id = ${site}) AS areas_n,
      (SELECT MAX(updated_at) FROM areas WHERE site_id = ${site}) AS areas_at`,
    { replacements: { surveyId }, type: QueryTypes.SELECT },
  );
  const stamps = [row.verdicts_at, row.traps_at, row.areas_at].map(stamp);
  const counts = [row.test_writes, row.verdicts_n, row.traps_n, row.areas_n].map((n) => Number(n ?? 0));
  return { key: `${surveyId}:${counts.join(',')}:${stamps.join(',')}`, settled: Math.max(...stamps) < Date.now() - SETTLE_MS };
}

/** The count of writes to a survey's tests (0 before the first): a version of anything read from them alone. */
export async function testWrites(surveyId: number): Promise<number> {
  const [row] = await sequelize.query<{ writes: number | string }>('SELECT writes FROM survey_test_writes WHERE survey_id = :surveyId', {
    replacements: { surveyId }, type: QueryTypes.SELECT,
  });
  return Number(row?.writes ?? 0);
}

/**
 * Results kept per key while the version they were computed from stands, the few most recently
 * used. Concurrent requests for the same settled version share one computation; a result of an
 * unsettled version is handed back but not kept.
 */
export class DerivedCache<T> {
  private readonly entries = new Map<string, { version: string; value: Promise<T> }>();

  constructor(private readonly capacity: number) {}

  get(key: string, version: DataVersion, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit && hit.version === version.key) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    const value = compute();
    if (!version.settled) {
      if (hit) this.entries.delete(key);
      return value;
    }
    this.entries.delete(key);
    this.entries.set(key, { version: version.key, value });
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
    value.catch(() => {
      if (this.entries.get(key)?.value === value) this.entries.delete(key);
    });
    return value;
  }
}
