// Puts a failed request's field issues under the matching form fields; whatever matches no field is returned
// as one message for the top of the form.
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  const leftover: string[] = [];
  let placed = 0;
  for (const issue of error.issues) {
    // The server may prefix paths with the part of the request they came from ("body.name").
    const path = issue.path.replace(/^body\./, '');
    const field = fields.find((f) => f === path);
    if (field) {
      setError(field, { type: 'server', message: issue.message }, { shouldFocus: placed === 0 });
      placed += 1;
    } else {
      leftover.push(issue.message);
    }
  }
  if (placed > 0 && leftover.length === 0) return null;
  return leftover.length > 0 ? leftover.join(' ') : error.message;
}
