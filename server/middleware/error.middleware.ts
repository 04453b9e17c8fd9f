import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError as SequelizeBaseError, UniqueConstraintError, ValidationError } from 'sequelize';
import { z } from 'zod';
import { AppError } from '../errors/app-error';

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string>; [extra: string]: unknown };
}

function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Maps anything thrown to status + body; never leaks internals. */
export function toErrorResponse(err: unknown): {
  status: number;
  body: ErrorBody;
  headers?: Record<string, string>;
} {
  if (err instanceof AppError) {
    return {
      status: err.status,
      headers: err.headers,
      body: {
        error: {
          ...(err.details ?? {}),
          code: err.code,
          message: err.message,
          ...(err.fields ? { fields: err.fields } : {}),
        },
      },
    };
  }
  if (err instanceof z.ZodError) {
    const fields = zodFields(err);
    const summary = Object.entries(fields)
      .map(([k, v]) => (k === '_' ? v : `${k}: ${v}`))
      .join('; ');
    return {
      status: 400,
      body: { error: { code: 'invalid_input', message: `Invalid input. ${summary}`, fields } },
    };
  }
  if (err instanceof UniqueConstraintError) {
    return { status: 409, body: { error: { code: 'conflict', message: 'That already exists.' } } };
  }
  if (err instanceof ValidationError) {
    const fields: Record<string, string> = {};
    for (const item of err.errors) if (item.path) fields[item.path] ??= item.message;
    return {
      status: 400,
      body: { error: { code: 'invalid_input', message: 'Invalid input.', fields } },
    };
  }
  // body-parser and http-errors style errors carry type/status.
  const e = err as { type?: string; status?: number; statusCode?: number; expose?: boolean };
  if (e && typeof e === 'object' && !(err instanceof SequelizeBaseError)) {
    if (e.type === 'entity.parse.failed') {
      return {
        status: 400,
        body: { error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } },
      };
    }
    if (e.type === 'entity.too.large') {
      return {
        status: 413,
        body: { error: { code: 'payload_too_large', message: 'The request body is larger than 2 MB.' } },
      };
    }
    const status = e.status ?? e.statusCode;
    if (typeof status === 'number' && status >= 400 && status < 500) {
      return {
        status,
        body: { error: { code: 'bad_request', message: e.expose ? String((err as Error).message) : 'Bad request.' } },
      };
    }
  }
  return {
    status: 500,
    body: { error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } },
  };
}

export function errorHandler(log: (err: unknown) => void = console.error): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    const { status, body, headers } = toErrorResponse(err);
    if (status >= 500) log(err);
    if (headers) for (const [k, v] of Object.entries(headers)) res.setHeader(k, v);
    res.status(status).json(body);
  };
}

/** Unknown /api paths answer JSON, never the SPA page. */
export const apiNotFound: RequestHandler = (req) => {
  throw new AppError(404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`);
};
