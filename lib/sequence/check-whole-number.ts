import { SequenceError } from './sequence-error';

/**
 * Throws `invalid-argument` unless `value` is a whole number in [minimum, maximum]. Shared guard for alphabet sizes,
 * word orders, block counts and run counts; `field` names the argument in the message.
 */
export function checkWholeNumber(field: string, value: number, minimum: number, maximum: number = Number.MAX_SAFE_INTEGER): void {
  if (!Number.isInteger(value) || value < minimum || value > maximum) {
    const range = maximum === Number.MAX_SAFE_INTEGER ? `at least ${minimum}` : `from ${minimum} to ${maximum}`;
    throw new SequenceError('invalid-argument', `${field} must be a whole number ${range}; got ${String(value)}.`, {
      field,
      value,
      minimum,
      maximum,
    });
  }
}
