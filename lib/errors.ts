/**
 * One error type for everything a request can be refused for. Each code maps to an HTTP status;
 * the message is safe to show to the person using Meniscus.
 */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fieldErrors?: FieldErrors;
  /** Extra machine-readable detail returned with the error (never secrets). */
  readonly detail?: Record<string, unknown>;

  constructor(code: ErrorCode, message: string, options?: { fieldErrors?: FieldErrors; detail?: Record<string, unknown> }) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.fieldErrors = options?.fieldErrors;
    this.detail = options?.detail;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, fieldErrors: this.fieldErrors, ...this.detail } };
  }
}

export const notFound = (what = "That item") => new AppError("not_found", `${what} was not found, or you do not have access to it.`);
export const forbidden = (message = "You do not have permission to do that.") => new AppError("forbidden", message);
export const unauthorized = () => new AppError("unauthorized", "Please sign in first.");
