import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError } from '../../../server/errors/app-error';
import { toErrorResponse } from '../../../server/middleware/error.middleware';

describe('toErrorResponse', () => {
  it('when given an AppError, then status, code, message, fields and headers pass through', () => {
    const err = new AppError(429, 'rate_limited', 'Slow down.', { headers: { 'Retry-After': '9' } });
    expect(toErrorResponse(err)).toEqual({
      status: 429,
      headers: { 'Retry-After': '9' },
      body: { error: { code: 'rate_limited', message: 'Slow down.' } },
    });
  });

  it('when given a ZodError, then 400 invalid_input with fields keyed by path', () => {
    const schema = z.object({ name: z.string().min(1, 'Name is required'), levels: z.array(z.object({ elevationFt: z.number() })) });
    const parsed = schema.safeParse({ name: '', levels: [{ elevationFt: 'x' }] });
    const out = toErrorResponse(parsed.error);
    expect(out.status).toBe(400);
    expect(out.body.error.code).toBe('invalid_input');
    expect(out.body.error.fields).toEqual({
      name: 'Name is required',
      'levels.0.elevationFt': expect.any(String),
    });
    expect(out.body.error.message).toContain('name: Name is required');
  });

  it('when given an unexpected error, then 500 with a generic message that leaks nothing', () => {
    const out = toErrorResponse(new Error('SQLITE_ERROR: no such table: secrets'));
    expect(out.status).toBe(500);
    expect(out.body).toEqual({
      error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' },
    });
  });

  it('when given a body-parser error, then 400 invalid_json or 413', () => {
    expect(toErrorResponse({ type: 'entity.parse.failed', status: 400 }).status).toBe(400);
    expect(toErrorResponse({ type: 'entity.too.large', status: 413 }).status).toBe(413);
  });
});
