import { SequenceError } from './sequence-error';
import type { RunTiming } from './types';

const isFiniteNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);

function checkInterval(field: string, value: unknown): void {
  if (!isFiniteNumber(value) || value < 0) {
    throw new SequenceError('invalid-iti', `${field} must be a number of seconds ≥ 0; got ${String(value)}.`, { field, value });
  }
}

/**
 * Throws a typed error unless `timing` is usable: trial duration > 0 s (`duration-not-positive`), TR > 0 s
 * (`tr-not-positive`), dummy volumes a whole number ≥ 0, and an ITI distribution with finite times ≥ 0 whose
 * parameters are consistent (`invalid-iti`: uniform needs min < max; truncated exponential needs
 * min < mean < (min + max)/2).
 */
export function validateTiming(timing: RunTiming): void {
  if (!isFiniteNumber(timing.trialDuration) || timing.trialDuration <= 0) {
    throw new SequenceError(
      'duration-not-positive',
      `The trial duration must be a number of seconds greater than 0; got ${String(timing.trialDuration)}.`,
      { field: 'trialDuration', value: timing.trialDuration },
    );
  }
  if (!isFiniteNumber(timing.tr) || timing.tr <= 0) {
    throw new SequenceError('tr-not-positive', `The TR must be a number of seconds greater than 0; got ${String(timing.tr)}.`, {
      field: 'tr',
      value: timing.tr,
    });
  }
  const dummies = timing.dummyVolumes ?? 0;
  if (!Number.isInteger(dummies) || dummies < 0) {
    throw new SequenceError('invalid-argument', `Dummy volumes must be a whole number ≥ 0; got ${String(dummies)}.`, {
      field: 'dummyVolumes',
      value: dummies,
    });
  }
  const iti = timing.iti;
  switch (iti.kind) {
    case 'fixed':
      checkInterval('iti.duration', iti.duration);
      return;
    case 'uniform':
      checkInterval('iti.min', iti.min);
      checkInterval('iti.max', iti.max);
      if (!(iti.min < iti.max)) {
        throw new SequenceError('invalid-iti', `A uniform ITI needs min < max; got [${iti.min}, ${iti.max}] s. Use a fixed ITI for one value.`, {
          field: 'iti.max',
          value: iti.max,
        });
      }
      return;
    case 'truncated-exponential': {
      checkInterval('iti.min', iti.min);
      checkInterval('iti.max', iti.max);
      checkInterval('iti.mean', iti.mean);
      const midpoint = (iti.min + iti.max) / 2;
      if (!(iti.min < iti.mean && iti.mean < midpoint)) {
        throw new SequenceError(
          'invalid-iti',
          `A truncated exponential ITI needs min < mean < (min + max)/2 = ${midpoint} s; got min ${iti.min}, mean ${iti.mean}, max ${iti.max} s.`,
          { field: 'iti.mean', value: iti.mean, minimum: iti.min, maximum: midpoint },
        );
      }
      return;
    }
    default: {
      const unknown: { kind?: unknown } = iti;
      throw new SequenceError('invalid-iti', `Unknown ITI distribution ${String(unknown.kind)}.`, { field: 'iti.kind', value: unknown.kind });
    }
  }
}
