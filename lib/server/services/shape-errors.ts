import 'server-only';
import { AppError, validationError } from '@/lib/errors';
import { ShapeError, type ShapeDescriptor } from '@/lib/shape';
import { shapeErrorField } from '@/lib/shape-error-field';

/**
 * Puts an engine error into the app's vocabulary: a 400 whose field is the offending harmonic's input
 * (`descriptor.terms.<i>.<field>`) when the engine names one, else `fallbackField`.
 */
export function shapeErrorToAppError(error: unknown, area: string, fallbackField: string, descriptor?: ShapeDescriptor): unknown {
  if (error instanceof AppError || !(error instanceof ShapeError)) return error;
  const field = shapeErrorField(error, descriptor);
  const key = field ? `descriptor.${field}` : fallbackField;
  const message = error.message.charAt(0).toUpperCase() + error.message.slice(1);
  return validationError(area, `${message}.`, { [key]: [message] });
}
