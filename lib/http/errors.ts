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

/** Shape any thrown value for a response: AppErrors as they are, the rest as a generic 500 (logged). */
export function toErrorBody(err: unknown): { status: number; body: ErrorBody } {
  if (err instanceof AppError) {
    return { status: err.status, body: { error: { code: err.code, message: err.message, details: err.details } } };
  }
  console.error('Unexpected error', err);
  return { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.' } } };
}
