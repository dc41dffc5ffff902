import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../api';

/**
 * Puts the server's 422 field errors under the matching fields; anything that names no field
 * of this form comes back as the form-level message.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly string[],
): string | null {
  if (!(error instanceof ApiError)) return error instanceof Error ? error.message : String(error);
  let placed = 0;
  for (const [key, messages] of Object.entries(error.fieldErrors)) {
    const field = fields.find((f) => key === f || key.startsWith(`${f}.`));
    if (field && messages[0]) {
      setError(field as Path<T>, { type: 'server', message: messages[0] });
      placed++;
    }
  }
  if (error.status === 409)
    return `${error.message} Close this dialog to see the current values, then edit again.`;
  return placed > 0 && error.status === 422 ? 'Some fields need attention.' : error.message;
}

/** aria wiring for a control whose error is shown by <Field id=…>. */
export function ariaFor(id: string, message: string | undefined) {
  return {
    id,
    'aria-invalid': message ? true : undefined,
    'aria-describedby': message ? `${id}-error` : undefined,
  };
}
