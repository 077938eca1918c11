// One application error with a code, mapped to an HTTP status by the route wrapper and shown by actions.
export const ERROR_STATUS = {
  malformed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_type: 415,
  invalid: 422,
  too_many_attempts: 429,
} as const;

export type ErrorKind = keyof typeof ERROR_STATUS;

export class AppError extends Error {
  constructor(
    readonly kind: ErrorKind,
    message: string,
    /** The machine-readable code in the JSON body; defaults to the kind. */
    readonly code: string = kind,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "AppError";
  }

  get status(): number {
    return ERROR_STATUS[this.kind];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} was not found`);
export const invalidField = (field: string, message: string) =>
  new AppError("invalid", `${field}: ${message}`, "invalid", { [field]: message });
