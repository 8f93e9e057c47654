/**
 * Puts a server problem onto a react-hook-form form: each field message lands on its field,
 * and the overall message becomes the root error shown above the submit button.
 */
import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { asProblem } from './api-client';

export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, formFields: readonly FieldPath<T>[]): void {
  const problem = asProblem(error);
  let placed = 0;
  for (const [path, message] of Object.entries(problem.fields ?? {})) {
    const field = formFields.find((f) => f === path || path.startsWith(`${f}.`));
    if (field) {
      setError(field, { type: 'server', message });
      placed += 1;
    }
  }
  const fieldMessages = Object.values(problem.fields ?? {});
  // A summary that only repeats the inline messages is noise; a 422 gets a short pointer instead.
  if (placed > 0 && fieldMessages.includes(problem.message)) return;
  const rootMessage = placed > 0 && problem.status === 422 ? 'Please fix the highlighted fields.' : problem.message;
  setError('root.server' as FieldPath<T>, { type: String(problem.status), message: rootMessage });
}
