// Typed errors with a public message (shown to users) and an internal cause (logged only).
export type FieldErrors = Record<string, string>;

/** Node's error codes for a peer that cannot be reached (refused, reset, timed out, not found). */
export const NETWORK_ERROR_CODES: ReadonlySet<string> = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "ENOTFOUND", "EAI_AGAIN"]);

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    readonly internalCause?: unknown,
  ) {
    super(message);
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = "Sign in to continue.") {
    super(401, "unauthorized", message);
  }
}

export class NotFoundError extends AppError {
  constructor(what = "That record") {
    super(404, "not_found", `${what} was not found.`);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = "Your role on this site does not allow this.") {
    super(403, "forbidden", message);
  }
}

export class ValidationError extends AppError {
  constructor(fields: FieldErrors, message = "Some values need attention.") {
    super(422, "invalid", message, fields);
  }
}

export class ConflictError extends AppError {
  /** `current`: the record as it stands now, for a client that must show both versions and ask. */
  constructor(message: string, fields?: FieldErrors, readonly current?: unknown) {
    super(409, "conflict", message, fields);
  }
}

export class TooManyRequestsError extends AppError {
  constructor(message: string) {
    super(429, "too_many_requests", message);
  }
}

/** Turns zod issues into { "a.b": "message" } (first message per field wins). */
export function fieldErrorsFromZod(issues: { path: PropertyKey[]; message: string }[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    const key = i.path.map(String).join(".") || "_";
    if (!(key in out)) out[key] = i.message;
  }
  return out;
}

export function errorBody(e: AppError) {
  const current = e instanceof ConflictError && e.current !== undefined ? { current: e.current } : {};
  return { error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}), ...current } };
}
