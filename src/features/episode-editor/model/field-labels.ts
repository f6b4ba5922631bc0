import type { DraftField } from '../model/draft';

/** The form's own words for its fields, used wherever a message names one. */
export const FIELD_LABELS: Record<DraftField, string> = {
  title: 'title',
  number: 'episode number',
  summary: 'summary',
  writeUp: 'write-up',
  videoUrl: 'video link',
  duration: 'video length',
  hoursWorked: 'hours worked',
  raisedVehicle: 'raised-vehicle mark',
  videoDisclosureConfirmed: 'video disclosure confirmation',
  chapters: 'chapters',
};

export function fieldLabel(field: DraftField): string {
  return FIELD_LABELS[field];
}
