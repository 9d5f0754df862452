import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts an API error's field messages on the form's fields (inline), and returns the message for the form as a
 * whole (shown above the submit button).
 */
export function applyApiError<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fields: readonly Path<T>[]): string {
  if (!(error instanceof ApiError)) return 'Could not reach the server. Check your connection and try again.';
  let placed = false;
  for (const [name, messages] of Object.entries(error.fields)) {
    if ((fields as readonly string[]).includes(name) && messages[0]) {
      setError(name as Path<T>, { type: 'server', message: messages[0] });
      placed = true;
    }
  }
  return placed && error.code.startsWith('validation:') ? 'Please correct the highlighted fields.' : error.message;
}
