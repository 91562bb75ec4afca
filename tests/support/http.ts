// A small HTTP client for the running app: signs in the way a browser does (csrf → credentials
// callback → session cookie) or carries a bearer token.
import { inject } from 'vitest';
import { DEMO_ANALYST_TOKEN, DEMO_PASSWORDS, DEMO_USERS } from '@/seeders/demo-scenario';

export const baseUrl = () => inject('baseUrl');

export type Reply = { status: number; body: any; headers: Headers };

export class Client {
  private cookies = new Map<string, string>();
  /** `base`: another server than the shared test server (tests/support/own-server.ts). */
  constructor(private readonly bearer?: string, private readonly base?: string) {}

  private remember(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1);
      if (/expires=Thu, 01 Jan 1970/i.test(line) || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async request(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply> {
    const h: Record<string, string> = { ...headers };
    if (this.cookies.size) h.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    if (this.bearer) h.authorization = `Bearer ${this.bearer}`;
    let payload: BodyInit | undefined;
    if (body instanceof URLSearchParams || body instanceof FormData) payload = body;
    // As it stands: fetch sends a string as text/plain;charset=UTF-8, as a browser's server-action call does.
    else if (typeof body === 'string') payload = body;
    else if (body !== undefined) {
      payload = JSON.stringify(body);
      h['content-type'] = 'application/json';
    }
    const res = await fetch((this.base ?? baseUrl()) + path, { method, headers: h, body: payload, redirect: 'manual' });
    this.remember(res);
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, body: parsed, headers: res.headers };
  }

  get = (path: string) => this.request('GET', path);
  post = (path: string, body?: unknown) => this.request('POST', path, body ?? {});
  patch = (path: string, body?: unknown) => this.request('PATCH', path, body ?? {});
  delete = (path: string) => this.request('DELETE', path);

  /** Signs in through next-auth's credentials flow; returns the callback's reply. */
  async signIn(email: string, password: string): Promise<Reply> {
    const csrf = await this.get('/api/auth/csrf');
    return this.request('POST', '/api/auth/callback/credentials', new URLSearchParams({ csrfToken: csrf.body.csrfToken, email, password, json: 'true' }));
  }
}

export async function signedIn(email: string, password: string, base?: string): Promise<Client> {
  const client = new Client(undefined, base);
  await client.signIn(email, password);
  const session = await client.get('/api/auth/session');
  if (!session.body?.user) throw new Error(`Could not sign in as ${email}: ${JSON.stringify(session.body)}`);
  return client;
}

/** The demo accounts, from the seed itself (one per role). */
export const DEMO = Object.fromEntries(
  DEMO_USERS.map((u) => [u.role, { email: u.email, password: DEMO_PASSWORDS[u.role] }]),
) as Record<(typeof DEMO_USERS)[number]['role'], { email: string; password: string }>;
export { DEMO_ANALYST_TOKEN };

let counter = 0;
/** A name no earlier call in this run has used. */
export const unique = (prefix: string) => `${prefix}-${process.pid}-${Date.now().toString(36)}-${++counter}`;
