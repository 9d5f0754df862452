import { describe, expect, it } from 'vitest';
import { AppError, ERROR_KINDS, kindOf, toProblemDetails, validationError } from '@/lib/errors';

describe('the error vocabulary', () => {
  it('takes the HTTP status from the kind of the code alone', () => {
    expect(new AppError('not_found:edition', 'x').status).toBe(404);
    expect(new AppError('conflict:edition', 'x').status).toBe(409);
    expect(new AppError('forbidden:members', 'x').status).toBe(403);
    expect(kindOf('nonsense:thing')).toBe('internal');
  });

  it('maps domain errors to RFC 9457 problem details with field messages', () => {
    const p = toProblemDetails(validationError('seed-shape', 'Fix the harmonics.', { 'terms.2.amplitude': ['Too large'] }), '/x');
    expect(p).toMatchObject({
      status: 400,
      code: 'validation:seed-shape',
      detail: 'Fix the harmonics.',
      title: ERROR_KINDS.validation.title,
      errors: { 'terms.2.amplitude': ['Too large'] },
      instance: '/x',
    });
    expect(p.type).toBe('/problems/validation/seed-shape');
  });

  it('reveals nothing of unknown errors', () => {
    const p = toProblemDetails(new Error('password=hunter2 at db.internal'));
    expect(p.status).toBe(500);
    expect(p.code).toBe('internal:server');
    expect(JSON.stringify(p)).not.toContain('hunter2');
  });

  it('keeps the original error as cause', () => {
    const original = new Error('boom');
    expect(new AppError('conflict:x', 'y', { cause: original }).cause).toBe(original);
  });
});
