import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/db';

/**
 * What an answer was computed from, as the database says now: the counts of writes to its
 * subjects, kept by triggers whoever writes (migrations/20261202090000-count-writes-by-subject.ts).
 * A count moves in the same transaction as the rows, so a version read *before* the data it
 * guards is never newer than that data: an answer computed after reading version v is current for
 * v or newer, and the next reader sees v move as soon as a write commits, through any instance.
 */
export type DataVersion = string;

type Subject = 'survey' | 'site' | 'user-names';

/**
 * The version of everything read from a survey and its site: the survey's row, tests and
 * decisions; the site's row, traps, areas and cost settings; and the users' names (who decided).
 * One query of three primary-key lookups.
 */
export async function surveyDataVersion(surveyId: number): Promise<DataVersion> {
  const [row] = await sequelize.query<{ survey: number | string | null; site: number | string | null; names: number | string | null }>(
    `SELECT
      (SELECT writes FROM write_counts WHERE subject = 'survey' AND subject_id = :surveyId) AS survey,
      (SELECT writes FROM write_counts WHERE subject = 'site' AND subject_id = (SELECT site_id FROM surveys WHERE id = :surveyId)) AS site,
      (SELECT writes FROM write_counts WHERE subject = 'user-names' AND subject_id = 0) AS names`,
    { replacements: { surveyId }, type: QueryTypes.SELECT },
  );
  return `survey ${surveyId}:${Number(row.survey ?? 0)}:${Number(row.site ?? 0)}:${Number(row.names ?? 0)}`;
}

/** The count of writes to one subject (0 before the first). */
async function writesTo(subject: Subject, id: number): Promise<number> {
  const [row] = await sequelize.query<{ writes: number | string }>('SELECT writes FROM write_counts WHERE subject = :subject AND subject_id = :id', {
    replacements: { subject, id }, type: QueryTypes.SELECT,
  });
  return Number(row?.writes ?? 0);
}

/** The version of a site's register: its row, traps, areas and cost settings. */
export async function siteDataVersion(siteId: number): Promise<DataVersion> {
  return `site ${siteId}:${await writesTo('site', siteId)}`;
}

/** The version of a survey's own rows alone: its row, tests and decisions. */
export async function surveyRowsVersion(surveyId: number): Promise<DataVersion> {
  return `survey rows ${surveyId}:${await writesTo('survey', surveyId)}`;
}

/**
 * Results kept per key while the version they were computed from stands, the most recently used
 * within a budget (a count of entries, or a total size when each result says how large it is).
 * Concurrent requests for the same version share one computation; a failed one is not kept.
 */
export class DerivedCache<T> {
  private readonly entries = new Map<string, { version: DataVersion; value: Promise<T>; size: number }>();
  private used = 0;

  /** `capacity`: the budget; `sizeOf` measures a result against it (1 each when not given). */
  constructor(private readonly capacity: number, private readonly sizeOf: (value: T) => number = () => 1) {}

  get(key: string, version: DataVersion, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit && hit.version === version) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    this.drop(key);
    const value = compute();
    const entry = { version, value, size: 0 };
    this.entries.set(key, entry);
    value.then(
      (result) => {
        if (this.entries.get(key) !== entry) return;
        entry.size = this.sizeOf(result);
        this.used += entry.size;
        this.trim();
      },
      () => {
        if (this.entries.get(key) === entry) this.drop(key);
      },
    );
    return value;
  }

  private drop(key: string) {
    const entry = this.entries.get(key);
    if (!entry) return;
    this.used -= entry.size;
    this.entries.delete(key);
  }

  private trim() {
    // The newest entry stays even when it alone is over the budget: it is the one being asked for.
    while (this.used > this.capacity && this.entries.size > 1) this.drop(this.entries.keys().next().value!);
  }
}
