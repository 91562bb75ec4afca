import 'server-only';
import os from 'node:os';
import { Op, type InferAttributes, type Transaction, type WhereOptions } from 'sequelize';
import { Upload } from '@/models';

/** This instance's name: PLUMEWARD_INSTANCE, else the host name (give each process on one host its own). */
export const instanceName = () => (process.env.PLUMEWARD_INSTANCE || os.hostname()).slice(0, 120);

/**
 * Another instance took the upload over while this one was still working on it (this one was
 * silent for so long that it looked gone). Nothing of this instance's is written after that: it
 * stops, and the one that took the upload over imports what is left.
 */
export class UploadClaimLost extends Error {
  constructor(readonly uploadId: number) {
    super(`Upload ${uploadId} was taken over by another instance; this one stops working on it.`);
    this.name = 'UploadClaimLost';
  }
}

/** Where the upload is this instance's to write to: processing under its claim. */
const held = (uploadId: number) => ({ id: uploadId, status: 'processing' as const, claimedBy: instanceName() });

/** One conditional UPDATE: of two instances reaching for the same upload, exactly one changes the row. */
async function claimWhere(uploadId: number, where: WhereOptions<Upload>, transaction: Transaction, also: Partial<InferAttributes<Upload>> = {}) {
  const [taken] = await Upload.update(
    { status: 'processing', claimedBy: instanceName(), claimedAt: new Date(), ...also },
    { where: { id: uploadId, ...where }, transaction },
  );
  return taken === 1;
}

/** The worker takes a queued upload for this instance; false when another took it first. */
export function takeQueued(uploadId: number, transaction: Transaction): Promise<boolean> {
  return claimWhere(uploadId, { status: 'queued' }, transaction);
}

/**
 * Takes the upload to process it: a queued one (as scripts and the demo seeder hand it over), or
 * one this instance's worker has claimed already. False when another instance holds it.
 */
export function startProcessing(uploadId: number, transaction: Transaction, startedAt: Date): Promise<boolean> {
  return claimWhere(uploadId, { [Op.or]: [{ status: 'queued' }, held(uploadId)] }, transaction, { startedAt, error: null });
}

/**
 * Inside a transaction that writes an upload's results: renews this instance's claim, or throws
 * UploadClaimLost when another instance holds it now, so that transaction writes nothing. The
 * claim's row is locked from here to the commit (PostgreSQL) or the database is (SQLite), so a
 * takeover cannot land between this check and the writes.
 */
export async function assertStillHeld(uploadId: number, transaction: Transaction): Promise<void> {
  if (!(await renewClaim(uploadId, transaction))) throw new UploadClaimLost(uploadId);
}

/** Renews this instance's claim on the upload (its heartbeat too); false when another instance holds it now. */
export async function renewClaim(uploadId: number, transaction: Transaction): Promise<boolean> {
  const [renewed] = await Upload.update({ claimedAt: new Date() }, { where: held(uploadId), transaction });
  return renewed === 1;
}
