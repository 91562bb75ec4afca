import 'server-only';
import { Op } from 'sequelize';
import { writeTransaction } from '@/lib/db';
import { Upload } from '@/models';
import { processUpload } from './process-upload';
import { clearIncoming } from './receive-upload';

// One background worker per server process: uploads are processed one at a time, in order.
// State lives in the database, so a restart finds what was interrupted and does it again
// (each file lands in one transaction: a file is either wholly imported or not at all).

const state = globalThis as unknown as { plumewardImportWorker?: { running: boolean; again: boolean; started: boolean } };
const worker = (state.plumewardImportWorker ??= { running: false, again: false, started: false });

export async function startImportWorker() {
  if (worker.started) return;
  worker.started = true;
  await writeTransaction((transaction) => Upload.update({ status: 'queued' }, { where: { status: 'processing' }, transaction }));
  await clearIncoming().catch((err) => console.warn('Could not tidy the incoming upload folder', err));
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
        for (;;) {
          const next = await Upload.findOne({ where: { status: { [Op.in]: ['queued'] } }, order: [['id', 'ASC']] });
          if (!next) break;
          await processUpload(next.id).catch(async (err) => {
            console.error(`Upload ${next.id} failed`, err);
            await writeTransaction((transaction) => Upload.update({ status: 'failed', error: 'The import stopped on an unexpected error; it has been logged.', finishedAt: new Date() }, { where: { id: next.id }, transaction }));
          });
        }
      } while (worker.again);
    } finally {
      worker.running = false;
    }
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
