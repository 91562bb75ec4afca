// One error type whose message may reach the user; anything else becomes a generic 500.
export const ERROR_STATUS = {
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  invalid: 422,
  rate_limited: 429,
  internal: 500,
  // The server's own disk, not the request: 503 while the data directory cannot be written (it
  // may be again once an administrator fixes it), 507 Insufficient Storage (RFC 4918 §11.5) when full.
  storage_unwritable: 503,
  storage_full: 507,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export type ErrorBody = { error: { code: ErrorCode; message: string; details?: unknown } };

export const notFound = (what = 'record') => new AppError('not_found', `No such ${what}.`);

export type StorageFault = 'full' | 'unwritable';

const FS_FAULTS: Record<string, StorageFault> = { ENOSPC: 'full', EDQUOT: 'full', EROFS: 'unwritable', EACCES: 'unwritable', EPERM: 'unwritable' };
// SQLite's result codes, and PostgreSQL's SQLSTATEs disk_full and read_only_sql_transaction.
const DATABASE_FAULTS: Record<string, StorageFault> = { SQLITE_FULL: 'full', SQLITE_READONLY: 'unwritable', 53100: 'full', 25006: 'unwritable' };

/** The error's code, or its cause's (Sequelize keeps the driver's error as `parent`). */
function codesOf(err: unknown): string[] {
  const codes: string[] = [];
  for (let e = err as { code?: unknown; parent?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (typeof e.code === 'string') codes.push(e.code);
    e = (e.parent ?? e.cause) as typeof e;
  }
  return codes;
}

/** Whether a file-system error means the disk is full or cannot be written. */
export function fileStorageFault(err: unknown): StorageFault | null {
  return codesOf(err).map((c) => FS_FAULTS[c]).find(Boolean) ?? null;
}

/** Whether a database error means the database's disk is full or it cannot be written. */
export function databaseStorageFault(err: unknown): StorageFault | null {
  return codesOf(err).map((c) => DATABASE_FAULTS[c]).find(Boolean) ?? null;
}

/** What a user is told when a write was refused by the database's disk; nothing of the change was kept. */
export function databaseStorageError(fault: StorageFault): AppError {
  return fault === 'full'
    ? new AppError('storage_full', "The server's database is full: its disk has no space left, so this change was not saved. Free space on the data disk (or ask your administrator to), then try again.")
    : new AppError('storage_unwritable', "The server's database cannot be written (its data directory is read-only or not writable), so this change was not saved. Your administrator must make it writable; then try again.");
}

/** Shape any thrown value for a response: AppErrors as they are, the rest as a generic 500 (logged). */
export function toErrorBody(err: unknown): { status: number; body: ErrorBody } {
  const dbFault = err instanceof AppError ? null : databaseStorageFault(err);
  if (dbFault) {
    console.error('The database could not be written', err);
    err = databaseStorageError(dbFault);
  }
  if (err instanceof AppError) {
    return { status: err.status, body: { error: { code: err.code, message: err.message, details: err.details } } };
  }
  console.error('Unexpected error', err);
  return { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.' } } };
}
