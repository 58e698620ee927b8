/**
 * The one error class of Benchfold. Every failure a caller may see carries a code;
 * the code decides the HTTP status, and clients map codes to their own wording.
 */
export const errorStatus = {
  "bad-request": 400,
  unauthenticated: 401,
  forbidden: 403,
  "not-found": 404,
  conflict: 409,
  "payload-too-large": 413,
  "unsupported-media-type": 415,
  invalid: 422,
  "rate-limited": 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details?: Record<string, unknown>;

  constructor(code: ErrorCode, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return errorStatus[this.code];
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, ...(this.details ? { details: this.details } : {}) } };
  }
}

export function isAppError(value: unknown): value is AppError {
  return value instanceof AppError;
}
