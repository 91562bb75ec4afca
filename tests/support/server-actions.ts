// Server actions called over HTTP as Next's client router calls them (node_modules/next/dist/client/
// components/router-reducer/reducers/server-action-reducer.js, fetchServerAction): a POST to the
// page the form is on, with `Next-Action: <id>`, `Accept: text/x-component` and the arguments
// encoded by React's encodeReply; the reply is React's flight format, row 0 carrying the action's
// result under `a`.
import fs from 'node:fs';
import path from 'node:path';
import { baseUrl, type Client } from './http';

const root = path.resolve(__dirname, '../..');

/** One server action of the build, as its server reference manifest lists it. */
export type BuiltAction = {
  id: string;
  exportedName: string;
  /** The module that exports it, relative to the project. */
  filename: string;
  /** The app-router pages whose bundles carry it, e.g. `app/(workbench)/settings/users/page`. */
  pages: string[];
};

type ManifestEntry = { workers: Record<string, unknown>; filename: string; exportedName: string };

/** Every server action of the build in `NEXT_DIST_DIR` (or `.next`), both runtimes. */
export function builtActions(distDir = process.env.NEXT_DIST_DIR || '.next'): BuiltAction[] {
  const file = path.join(root, distDir, 'server', 'server-reference-manifest.json');
  const manifest = JSON.parse(fs.readFileSync(file, 'utf8')) as Record<'node' | 'edge', Record<string, ManifestEntry>>;
  return [...Object.entries(manifest.node ?? {}), ...Object.entries(manifest.edge ?? {})].map(([id, entry]) => ({
    id,
    exportedName: entry.exportedName,
    filename: entry.filename,
    pages: Object.keys(entry.workers).filter((w) => w.endsWith('/page')).sort(),
  }));
}

/**
 * The URL of an app-router page (`app/(workbench)/sites/[siteId]/areas/page` → `/sites/7/areas`):
 * route groups dropped, each `[param]` filled from `params`.
 */
export function pageUrl(page: string, params: Record<string, number | string>): string {
  const segments = page.replace(/^app\//, '').replace(/\/?page$/, '').split('/').filter((s) => s && !/^\(.*\)$/.test(s));
  return '/' + segments.map((s) => {
    const param = /^\[(\w+)\]$/.exec(s)?.[1];
    if (!param) return s;
    if (params[param] === undefined) throw new Error(`No value for [${param}] of ${page}.`);
    return encodeURIComponent(String(params[param]));
  }).join('/');
}

/**
 * React's encodeReply (processReply in react-server-dom-webpack's client) for arguments that need
 * no form-data parts: one JSON text with strings starting with `$` escaped as `$$`, and `undefined`,
 * dates, big integers and non-finite numbers as `$` words. Anything else React would send as
 * multipart form data, which this helper refuses rather than imitates.
 */
export function encodeReply(args: unknown[]): string {
  return JSON.stringify(args, function (this: Record<string, unknown>, key, value: unknown) {
    const original = this[key];
    if (original instanceof Date) return `$D${value as string}`;
    if (typeof value === 'string') return value.startsWith('$') ? `$${value}` : value;
    if (value === undefined) return '$undefined';
    if (typeof value === 'bigint') return `$n${value.toString(10)}`;
    if (typeof value === 'number') {
      if (Number.isNaN(value)) return '$NaN';
      if (value === Infinity) return '$Infinity';
      if (value === -Infinity) return '$-Infinity';
      return Object.is(value, -0) ? '$-0' : value;
    }
    if (value === null || typeof value === 'boolean' || Array.isArray(value)) return value;
    if (typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) return value;
    throw new Error(`encodeReply here takes plain JSON-like values only, not ${Object.prototype.toString.call(value)} at "${key}".`);
  });
}

// Rows whose payload is length-prefixed (`<id>:<tag><hex length>,<bytes>`) rather than ended by a
// newline: the tags the flight client's processBinaryChunk reads that way.
const LENGTH_PREFIXED = new Set('TAOobUSsLlGgMmV');

type Row = { tag: string; data: string };

/** The rows of a flight response by id (hex), for the few this helper needs to read. */
export function flightRows(bytes: Uint8Array): Map<string, Row> {
  const buffer = Buffer.from(bytes);
  const rows = new Map<string, Row>();
  let i = 0;
  while (i < buffer.length) {
    const colon = buffer.indexOf(0x3a, i);
    if (colon < 0) throw new Error(`Flight row without an id at byte ${i}.`);
    const id = buffer.toString('latin1', i, colon);
    let j = colon + 1;
    const first = String.fromCharCode(buffer[j]);
    let tag = '';
    let data: string;
    if (LENGTH_PREFIXED.has(first)) {
      const comma = buffer.indexOf(0x2c, j + 1);
      const length = parseInt(buffer.toString('latin1', j + 1, comma), 16);
      tag = first;
      data = buffer.toString('utf8', comma + 1, comma + 1 + length);
      i = comma + 1 + length;
    } else {
      // Upper-case letters, '#', 'r' and 'x' tag a newline-ended row; anything else starts JSON.
      if (/^[A-Z#rx]$/.test(first)) {
        tag = first;
        j += 1;
      }
      const end = buffer.indexOf(0x0a, j);
      data = buffer.toString('utf8', j, end < 0 ? buffer.length : end);
      i = end < 0 ? buffer.length : end + 1;
    }
    if (id) rows.set(id, { tag, data });
  }
  return rows;
}

/** A chunk the server sent as an error row (`E`), e.g. a refused or failed action: production sends only a digest. */
export class FlightError extends Error {
  constructor(readonly digest: string | undefined) {
    super(`The server answered with an error (digest ${digest}).`);
  }
}

/** The value of row `id`, `$` references resolved (parseModelString in the flight client, for plain data). */
export function flightValue(rows: Map<string, Row>, id: string): unknown {
  const row = rows.get(id);
  if (!row) throw new Error(`The flight response has no row ${id}.`);
  if (row.tag === 'E') throw new FlightError((JSON.parse(row.data) as { digest?: string }).digest);
  if (row.tag === 'T') return row.data;
  if (row.tag) throw new Error(`Row ${id} is a "${row.tag}" row, not plain data.`);
  return flightModel(rows, JSON.parse(row.data));
}

/** A value of a JSON row with its `$` words and references resolved. */
export function flightModel(rows: Map<string, Row>, value: unknown): unknown {
  if (Array.isArray(value)) return value.map((v) => flightModel(rows, v));
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, flightModel(rows, v)]));
  if (typeof value !== 'string' || !value.startsWith('$')) return value;
  const word = value.slice(1);
  if (word.startsWith('$')) return word;
  if (word === 'undefined') return undefined;
  if (word === 'NaN') return NaN;
  if (word === 'Infinity') return Infinity;
  if (word === '-Infinity') return -Infinity;
  if (word === '-0') return -0;
  if (word.startsWith('D')) return new Date(word.slice(1));
  if (word.startsWith('n')) return BigInt(word.slice(1));
  if (word.startsWith('Q')) return new Map(flightValue(rows, word.slice(1)) as [unknown, unknown][]);
  if (word.startsWith('W')) return new Set(flightValue(rows, word.slice(1)) as unknown[]);
  // `$@<id>`: a promise of that row; `$<id>` or `$<id>:path:to`: (part of) another row.
  const [ref, ...pathTo] = (word.startsWith('@') ? word.slice(1) : word).split(':');
  if (!/^[0-9a-f]+$/.test(ref)) throw new Error(`Flight value "${value}" is not plain data.`);
  return pathTo.reduce<unknown>((v, key) => (v as Record<string, unknown>)[key], flightValue(rows, ref));
}

export type ActionResultBody =
  | { ok: true; data: unknown }
  | { ok: false; error: { code: string; message: string; details?: unknown } };

export type ActionReply = {
  status: number;
  headers: Headers;
  /** The action's return value, or the FlightError the server sent in its place. */
  result: ActionResultBody | FlightError;
};

/** Calls a built action over HTTP from `page` (a path) with the client's cookies (or `headers.cookie` on a fresh client). */
export async function callAction(
  client: Client,
  action: BuiltAction,
  args: unknown[],
  { page, origin = new URL(baseUrl()).origin, headers = {} }: { page: string; origin?: string; headers?: Record<string, string> },
): Promise<ActionReply> {
  const res = await client.request('POST', page, encodeReply(args), {
    ...headers,
    accept: 'text/x-component',
    'next-action': action.id,
    origin,
  });
  const type = res.headers.get('content-type') ?? '';
  if (!type.startsWith('text/x-component')) {
    throw new Error(`${action.exportedName}: expected a flight response, got ${res.status} ${type}: ${String(res.body).slice(0, 300)}`);
  }
  const rows = flightRows(new TextEncoder().encode(typeof res.body === 'string' ? res.body : JSON.stringify(res.body)));
  const root = rows.get('0');
  if (!root || root.tag) throw new Error(`${action.exportedName}: the flight response has no root row.`);
  // Only the result: the rest of row 0 is the page's new tree, when the action revalidated it.
  const { a } = JSON.parse(root.data) as { a?: unknown };
  let result: ActionResultBody | FlightError;
  try {
    result = flightModel(rows, a) as ActionResultBody;
  } catch (err) {
    if (!(err instanceof FlightError)) throw err;
    result = err;
  }
  return { status: res.status, headers: res.headers, result };
}
