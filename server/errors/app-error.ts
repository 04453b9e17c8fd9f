// The one error type services and middleware throw. The error middleware turns it into
// {"error":{"code","message","fields"?}} with the given status.

export interface AppErrorOptions {
  fields?: Record<string, string>;
  /** Extra response headers, e.g. Retry-After on 429. */
  headers?: Record<string, string>;
  /** Extra members of the error body, e.g. problems on 422 or current on 409. */
  details?: Record<string, unknown>;
}

export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;
  readonly headers?: Record<string, string>;
  readonly details?: Record<string, unknown>;

  constructor(status: number, code: string, message: string, options: AppErrorOptions = {}) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.fields = options.fields;
    this.headers = options.headers;
    this.details = options.details;
  }

  static badRequest(message: string, fields?: Record<string, string>): AppError {
    return new AppError(400, 'invalid_input', message, { fields });
  }

  static unauthenticated(message = 'Sign in to continue.'): AppError {
    return new AppError(401, 'unauthenticated', message);
  }

  static forbidden(message = 'Your role does not allow this.'): AppError {
    return new AppError(403, 'forbidden', message);
  }

  static notFound(what = 'Resource'): AppError {
    return new AppError(404, 'not_found', `${what} not found.`);
  }

  static conflict(code: string, message: string, fields?: Record<string, string>): AppError {
    return new AppError(409, code, message, { fields });
  }
}
