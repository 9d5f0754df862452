import { expect } from 'vitest';
import { SequenceError, type SequenceErrorCode } from '@/lib/sequence';

/** Fixed seed for every fast-check property, so each run checks the same cases. */
export const PROPERTY_SEED = 20_261_214;

/** Runs `action`, expects a `SequenceError` with `code`, and returns it for further checks. */
export function expectSequenceError(action: () => unknown, code: SequenceErrorCode): SequenceError {
  let caught: unknown;
  try {
    action();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(SequenceError);
  const error = caught as SequenceError;
  expect(error.code).toBe(code);
  return error;
}

/** Symbols as one digit string, for comparison with published sequences such as 00010111. */
export const digits = (sequence: readonly number[]): string => sequence.join('');
