import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

interface IssueLike {
  path: (string | number)[];
  message: string;
}

function issuesOf(details: unknown): IssueLike[] {
  const list = Array.isArray(details)
    ? details
    : typeof details === 'object' && details !== null && Array.isArray((details as { issues?: unknown }).issues)
      ? (details as { issues: unknown[] }).issues
      : [];
  return list.filter(
    (issue): issue is IssueLike =>
      typeof issue === 'object' &&
      issue !== null &&
      Array.isArray((issue as IssueLike).path) &&
      typeof (issue as IssueLike).message === 'string',
  );
}

/**
 * Puts the API's 400 validation_failed issues beside the matching fields.
 * Returns true when at least one field received a message.
 */
export function applyApiFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): boolean {
  if (!isApiError(error) || error.code !== 'validation_failed') return false;
  let applied = false;
  for (const issue of issuesOf(error.details)) {
    const name = issue.path.join('.') as Path<T>;
    if (fields.includes(name)) {
      setError(name, { type: 'server', message: issue.message });
      applied = true;
    }
  }
  return applied;
}

export function isValidationFailure(error: unknown): boolean {
  return isApiError(error) && error.code === 'validation_failed';
}
