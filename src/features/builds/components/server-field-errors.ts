import type { FieldPath, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../../../lib/api-client';
import type { BuildFormValues } from '../lib/build-form';

const TOP_LEVEL = new Set([
  'title',
  'vehicleKind',
  'vehicleMake',
  'vehicleModel',
  'vehicleYear',
  'summary',
  'currency',
  'visibility',
  'videoLinkPattern',
]);

/** The form field a server field path belongs to: the budget is typed as text, system keys are made from names. */
function formField(path: string): FieldPath<BuildFormValues> | null {
  if (path === 'budgetMinor' || path === 'budget') return 'budget';
  if (TOP_LEVEL.has(path)) return path as FieldPath<BuildFormValues>;
  if (path === 'systems') return 'systems.root' as FieldPath<BuildFormValues>;
  const system = /^systems\.(\d+)\.(key|name|safetyCritical)$/.exec(path);
  if (system) return `systems.${Number(system[1])}.${system[2] === 'safetyCritical' ? 'safetyCritical' : 'name'}`;
  return null;
}

/**
 * Puts the server's 400 `fields` on the form. Returns the messages no field could take (shown as the
 * form's own notice), or null when the error carried no field messages at all.
 */
export function applyServerFieldErrors(err: unknown, setError: UseFormSetError<BuildFormValues>): string[] | null {
  if (!(err instanceof ApiError) || !err.fields) return null;
  const leftOver: string[] = [];
  for (const [path, messages] of Object.entries(err.fields)) {
    const message = messages[0];
    if (!message) continue;
    const field = formField(path);
    if (field) setError(field, { type: 'server', message });
    else leftOver.push(`${path}: ${message}`);
  }
  return leftOver;
}
