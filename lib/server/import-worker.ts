import 'server-only';
import { Op } from 'sequelize';
import { writeTransaction } from '@/lib/db';
import { databaseStorageFault, fileStorageFault } from '@/lib/http/errors';
import { SourceFile, Upload } from '@/models';
import { processUpload } from './process-upload';
import { clearIncoming } from './receive-upload';
import { instanceName, renewClaim, takeQueued, UploadClaimLost } from './upload-claim';

// One background worker per server process: uploads are processed one at a time, in order.
// State lives in the database, so a restart finds what was interrupted and does it again
// (each file lands in one transaction: a file is either wholly imported or not at all).
//
// Several instances may share one database (README, "Many sites, one database"). An upload is
// taken with one conditional UPDATE (queued → processing where it is still queued), so of two
// workers reaching for the same upload exactly one gets it; the loser's update changes no row.
// The taker writes its instance name and renews the time while it works: a restarting instance
// takes back only its own interrupted uploads, and another's only once that one has been silent
// for STALE_MS (it crashed and did not come back). Should the silent one have been only slow,
// its next write finds the claim gone and writes nothing (lib/server/upload-claim.ts). Idle
// workers look for queued uploads every POLL_MS, so an upload received by a busy instance is
// picked up by a free one.

const HEARTBEAT_MS = 30_000;
const STALE_MS = 10 * 60_000;
const POLL_MS = 30_000;

const state = globalThis as unknown as { plumewardImportWorker?: { running: boolean; again: boolean; started: boolean } };
const worker = (state.plumewardImportWorker ??= { running: false, again: false, started: false });

/** Puts back in the queue the uploads a worker holds that is gone: this instance before its restart, or any silent one. */
async function requeueAbandoned(includingMine: boolean) {
  const silent = { [Op.or]: [{ claimedAt: null }, { claimedAt: { [Op.lt]: new Date(Date.now() - STALE_MS) } }] };
  const where = { status: 'processing', ...(includingMine ? { [Op.or]: [{ claimedBy: instanceName() }, { claimedBy: null }, silent] } : silent) };
  // Read first: the poll runs every half minute and should not take SQLite's write lock for nothing.
  if (!(await Upload.findOne({ where, attributes: ['id'] }))) return;
  await writeTransaction((transaction) => Upload.update({ status: 'queued', claimedBy: null, claimedAt: null }, { where, transaction }));
}

/** Renews this instance's claim on the upload while `work` runs. */
async function holding<T>(uploadId: number, work: () => Promise<T>): Promise<T> {
  const timer = setInterval(() => {
    writeTransaction((transaction) => renewClaim(uploadId, transaction))
      .catch((err) => console.warn(`Could not renew the claim on upload ${uploadId}`, err));
  }, HEARTBEAT_MS);
  try {
    return await work();
  } finally {
    clearInterval(timer);
  }
}

export async function startImportWorker() {
  if (worker.started) return;
  worker.started = true;
  await requeueAbandoned(true);
  await clearIncoming().catch((err) => console.warn('Could not tidy the incoming upload folder', err));
  setInterval(kickImportWorker, POLL_MS).unref();
  kickImportWorker();
}

/** Asks the worker to look for queued uploads now (it is cheap to call often). */
export function kickImportWorker() {
  if (worker.running) {
    worker.again = true;
    return;
  }
  worker.running = true;
  setImmediate(async () => {
    try {
      do {
        worker.again = false;
        await requeueAbandoned(false);
        for (;;) {
          const next = await Upload.findOne({ where: { status: 'queued' }, order: [['id', 'ASC']], attributes: ['id'] });
          if (!next) break;
          if (!(await writeTransaction((transaction) => takeQueued(next.id, transaction)))) continue;
          await holding(next.id, () => processUpload(next.id)).catch(async (err) => {
            // Taken over by another instance: it goes on with the upload, this one leaves it be.
            if (err instanceof UploadClaimLost) return console.warn(err.message);
            console.error(`Upload ${next.id} failed`, err);
            await markFailed(next.id, importStoppedReason(err));
          });
        }
      } while (worker.again);
    } catch (err) {
      console.error('The import worker stopped on an error; it looks again at the next upload or poll', err);
    } finally {
      worker.running = false;
    }
  });
}

/** Why an import stopped, in words the user can act on. */
function importStoppedReason(err: unknown): string {
  const fault = databaseStorageFault(err) ?? fileStorageFault(err);
  if (fault === 'full') return "The import stopped because the server's disk is full: the files not yet read were not imported (nothing of them was kept). Free space on the data disk, then send them again.";
  if (fault === 'unwritable') return "The import stopped because the server's database cannot be written: the files not yet read were not imported (nothing of them was kept). Your administrator must make it writable; then send them again.";
  return 'The import stopped on an unexpected error; it has been logged.';
}

/**
 * The upload and its unread files are marked failed, with the reason. Left pending, the files
 * would make the same files sent again count as their duplicates, and never be imported.
 */
async function markFailed(uploadId: number, reason: string) {
  await writeTransaction(async (transaction) => {
    await Upload.update({ status: 'failed', error: reason, finishedAt: new Date() }, { where: { id: uploadId }, transaction });
    await SourceFile.update(
      { status: 'failed', problems: [{ code: 'import-stopped', severity: 'error', message: reason }] },
      { where: { uploadId, status: 'pending' }, transaction },
    );
  });
}

/** Resolves when the worker has nothing left to do (for scripts and tests). */
export async function importWorkerIdle(timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  while (worker.running || (await Upload.count({ where: { status: { [Op.in]: ['queued', 'processing'] } } })) > 0) {
    if (Date.now() > deadline) throw new Error('The import worker did not finish in time.');
    await new Promise((r) => setTimeout(r, 100));
  }
}
