import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts a failed request's errors on the form: each server field error beside its field,
 * anything else (wrong credentials, rate limit, a field this form does not show) as one
 * form-level message under `root.server`.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  formFields: readonly Path<T>[],
): void {
  if (!isApiError(error)) {
    setError('root.server', { type: 'server', message: 'Something went wrong. Try again.' });
    return;
  }
  const unplaced: string[] = [];
  let placed = 0;
  for (const [name, message] of Object.entries(error.fields ?? {})) {
    if ((formFields as readonly string[]).includes(name)) {
      setError(name as Path<T>, { type: 'server', message }, { shouldFocus: placed === 0 });
      placed += 1;
    } else {
      unplaced.push(message);
    }
  }
  if (placed === 0 || unplaced.length > 0) {
    setError('root.server', {
      type: 'server',
      message: placed === 0 ? error.message : unplaced.join(' '),
    });
  }
}
