import 'server-only';
import { createHash } from 'node:crypto';
import { DerivedCache, type DataVersion } from '@/lib/services/derived-cache';

/** A reply's body as sent, and its entity tag. */
export type KeptReply = { text: string; etag: string };

// Some 40 MB of JSON text per process: the busiest lists of a few surveys (a page of the review
// queue is some 200 KB) and every other list many times over.
const BUDGET_CHARS = 40 * 1024 * 1024;

const replies = new DerivedCache<KeptReply>(BUDGET_CHARS, (r) => r.text.length);

/**
 * A reply kept between requests while the version of the data it was made from stands
 * (lib/services/derived-cache.ts). `key` must name everything the reply depends on besides that
 * data: the route, its parameters and query, never who asks (the caller checks that first).
 */
export function keptReply(key: string, version: DataVersion, make: () => Promise<unknown>): Promise<KeptReply> {
  return replies.get(key, version, async () => {
    const text = JSON.stringify(await make());
    const etag = `"${createHash('sha1').update(version).update('\0').update(key).digest('base64url')}"`;
    return { text, etag };
  });
}
