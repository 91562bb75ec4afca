import 'server-only';
import fs from 'node:fs';
import path from 'node:path';
import { databasePath } from '@/lib/db';

// Original bytes, kept as received, named by their SHA-256: the same file twice is stored once,
// and a name from the user's computer never becomes a path on ours.

export function storeRoot(): string {
  return process.env.PLUMEWARD_STORE ?? path.join(path.dirname(databasePath()), 'uploads');
}

/**
 * `mkdir -p` that throws the real reason it could not: Node's recursive mkdir answers ENOENT when
 * a read-only or unwritable folder stops it, so the first missing folder is made alone to learn why.
 */
function makeDirs(dir: string) {
  try {
    fs.mkdirSync(dir, { recursive: true });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
    let missing = dir;
    while (!fs.existsSync(path.dirname(missing))) missing = path.dirname(missing);
    fs.mkdirSync(missing);
    throw err;
  }
}

/** Where incoming parts stream to before they are hashed and adopted (same disk, so moving is a rename). */
export function incomingDir(): string {
  const dir = path.join(storeRoot(), 'incoming');
  makeDirs(dir);
  return dir;
}

export function storedPath(sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error(`not a SHA-256: ${sha256}`);
  return path.join(storeRoot(), sha256.slice(0, 2), sha256);
}

/** Moves a received temporary file into the store under its hash; a copy already stored wins. */
export async function adopt(tempPath: string, sha256: string): Promise<void> {
  const target = storedPath(sha256);
  makeDirs(path.dirname(target));
  if (fs.existsSync(target)) {
    await fs.promises.rm(tempPath, { force: true });
    return;
  }
  await fs.promises.rename(tempPath, target);
  await fs.promises.chmod(target, 0o440);
}

/**
 * The stored bytes, read in one go. fs.promises.readFile makes several trips through the thread
 * pool (open, stat, read, close), each waiting for the main thread, which an import keeps busy
 * analysing: on a day of small files that cost more than reading them. Callers read whole files
 * into memory anyway, and a large one from the page cache takes milliseconds.
 */
export async function readStored(sha256: string): Promise<Buffer> {
  return fs.readFileSync(storedPath(sha256));
}

/** Stores bytes made on the server (demo files, tests) the same way received files are stored. */
export async function storeBytes(bytes: Uint8Array): Promise<string> {
  const { createHash, randomUUID } = await import('node:crypto');
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const temp = path.join(incomingDir(), randomUUID());
  await fs.promises.writeFile(temp, bytes);
  await adopt(temp, sha256);
  return sha256;
}
