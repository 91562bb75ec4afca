import 'server-only';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

// NEXTAUTH_SECRET in production; for the embedded demo, a random secret made once and kept
// beside the database so sessions survive a restart.
export function authSecret(): string {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  const dir = path.dirname(process.env.PLUMEWARD_DB ?? path.join(process.cwd(), 'data', 'plumeward.sqlite'));
  const file = path.join(dir, 'auth-secret');
  try {
    return fs.readFileSync(file, 'utf8').trim();
  } catch {
    fs.mkdirSync(dir, { recursive: true });
    const secret = randomBytes(32).toString('base64url');
    fs.writeFileSync(file, secret, { mode: 0o600, flag: 'wx' });
    return secret;
  }
}
