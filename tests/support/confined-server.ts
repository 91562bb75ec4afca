// An app server in a mount namespace of its own, where small tmpfs file systems stand in for its
// data directories: a test fills one, frees it, or makes it read-only, and the host's mounts are
// never touched (the namespace and its tmpfs vanish with the server). Without privileges this
// takes a user namespace (`unshare --user --map-root-user`); as root, a plain mount namespace
// will do if user namespaces are turned off. Both tools are util-linux, on every Debian system.
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort, nextStart, root, whenAnswering, type OwnServer } from './own-server';

/** A tmpfs of `sizeKb` mounted on `dir` (which must exist), starting with a copy of `copyFrom` in it (as `cp -a copyFrom dir/`: `folder/.` copies a folder's contents). */
export type ConfinedMount = { dir: string; sizeKb: number; copyFrom?: string };

export type ConfinedServer = OwnServer & {
  /** Runs a command in the server's namespace (as its root there); throws with its output if it fails. */
  inside: (command: string, ...args: string[]) => string;
  /** Makes a mounted tmpfs read-only or writable again (the mount's flag: an unprivileged user may not remount the file system itself). */
  remount: (dir: string, mode: 'ro' | 'rw') => void;
  /** Bytes the file system holding `dir` has free, and its block size, as seen by the server. */
  space: (dir: string) => { free: number; block: number };
  /** Every regular file under `dir` with its size and SHA-256, as seen by the server. */
  files: (dir: string) => Map<string, { size: number; sha256: string }>;
  stop: () => Promise<void>;
};

/** KiB that the files under `dir` take on a tmpfs (whole pages), for sizing one to hold a copy of them. */
export function kibOnTmpfs(dir: string): number {
  let kib = 0;
  for (const entry of fs.readdirSync(dir, { recursive: true, withFileTypes: true })) {
    if (entry.isFile()) kib += Math.ceil(fs.statSync(path.join(entry.parentPath, entry.name)).size / 4096) * 4;
  }
  return kib;
}

const WAYS = [
  // --preserve-credentials: an unprivileged user may not set groups in the namespace it made.
  { name: 'a user namespace', unshare: ['--user', '--map-root-user', '--mount'], nsenter: ['--user', '--mount', '--preserve-credentials'] },
  { name: 'a mount namespace (root)', unshare: ['--mount'], nsenter: ['--mount'] },
];

let chosen: (typeof WAYS)[number] | undefined;

/** The first way of confining a server that works on this machine (tried once, by mounting a tmpfs). */
function confinement() {
  if (chosen) return chosen;
  const probe = fs.mkdtempSync(path.join(os.tmpdir(), 'plumeward-confine-'));
  const tried: string[] = [];
  try {
    for (const way of WAYS) {
      const r = spawnSync('unshare', [...way.unshare, 'sh', '-c', 'mount -t tmpfs -o size=64k plumeward-probe "$1" && mount -o remount,bind,ro "$1"', 'sh', probe], { encoding: 'utf8' });
      if (r.status === 0) return (chosen = way);
      tried.push(`${way.name}: ${r.error?.message ?? r.stderr.trim()}`);
    }
  } finally {
    fs.rmSync(probe, { recursive: true, force: true });
  }
  throw new Error(
    `These tests need a private mount namespace to give the server a small or read-only file system, and none could be made here (uid ${process.getuid?.()}):\n  ${tried.join('\n  ')}\n`
    + 'Allow unprivileged user namespaces (sysctl kernel.unprivileged_userns_clone=1 / user.max_user_namespaces > 0), or run as root with CAP_SYS_ADMIN.',
  );
}

// Runs in the namespace before the server: mounts each tmpfs, copies its starting contents, then
// becomes the server (exec keeps the process id that nsenter targets).
const LAUNCH = `set -e
while [ "$1" != "--" ]; do
  mount -t tmpfs -o "size=$2k,mode=0777" plumeward-confined "$1"
  if [ -n "$3" ]; then cp -a "$3" "$1/"; fi
  shift 3
done
shift
exec "$@"`;

/** Serves the built app over `dbPath` inside its own mount namespace with the given tmpfs mounts. */
export async function startConfinedServer(dbPath: string, mounts: ConfinedMount[], env: Record<string, string> = {}): Promise<ConfinedServer> {
  const way = confinement();
  const start = nextStart(dbPath, await freePort());
  const mountArgs = mounts.flatMap((m) => [m.dir, String(m.sizeKb), m.copyFrom ?? '']);
  const child = spawn('unshare', [...way.unshare, 'sh', '-c', LAUNCH, 'sh', ...mountArgs, '--', start.command, ...start.args], {
    cwd: root, env: { ...start.env, ...env },
  });
  const server = await whenAnswering(child, start.baseUrl, dbPath);

  const inside = (command: string, ...args: string[]) => {
    const r = spawnSync('nsenter', ['--target', String(child.pid), ...way.nsenter, '--', command, ...args], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`${command} ${args.join(' ')} failed in the server's namespace: ${r.error?.message ?? r.stderr}`);
    return r.stdout;
  };
  return {
    ...server,
    inside,
    remount: (dir, mode) => void inside('mount', '-o', `remount,bind,${mode}`, dir),
    space: (dir) => {
      const [available, block] = inside('stat', '-f', '-c', '%a %S', dir).trim().split(' ').map(Number);
      return { free: available * block, block };
    },
    files: (dir) => {
      const listed = inside('find', dir, '-type', 'f', '-printf', '%s %p\\n').split('\n').filter(Boolean);
      const hashes = new Map(listed.length
        ? inside('sha256sum', ...listed.map((l) => l.slice(l.indexOf(' ') + 1))).split('\n').filter(Boolean).map((l) => [l.slice(66), l.slice(0, 64)])
        : []);
      return new Map(listed.map((l) => {
        const file = l.slice(l.indexOf(' ') + 1);
        return [path.relative(dir, file), { size: Number(l.slice(0, l.indexOf(' '))), sha256: hashes.get(file)! }];
      }));
    },
    stop: async () => {
      if (child.exitCode !== null) return;
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGKILL');
      await exited;
    },
  };
}
