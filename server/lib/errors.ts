/** The one error type. Handlers throw these; the error middleware turns them into the API's error shape. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new AppError(400, "validation_failed", message, fields);
export const unauthorized = (message = "Sign in to continue.") => new AppError(401, "unauthorized", message);
export const forbidden = (message = "Your role does not allow this.") => new AppError(403, "forbidden", message);
export const notFound = (what = "That record") => new AppError(404, "not_found", `${what} was not found.`);
export const conflict = (message: string, details?: Record<string, unknown>, code = "conflict") =>
  new AppError(409, code, message, undefined, details);
export const staleVersion = (current: unknown) =>
  new AppError(
    409,
    "stale_version",
    "Someone else saved this record after you opened it. Your changes were not saved; review theirs and try again.",
    undefined,
    { current },
  );
export const tooMany = (message: string, retryAfterSeconds: number) =>
  new AppError(429, "rate_limited", message, undefined, { retryAfterSeconds });
