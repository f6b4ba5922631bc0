import type { PartKind, PartSource, PartStatus } from '../../../shared/schemas/parts';

// The words of DESIGN.md ("Part line", "Money words") as the screens show them.
export const KIND_LABELS: Record<PartKind, string> = {
  part: 'Part',
  consumable: 'Consumable',
  tool: 'Tool',
  service: 'Service',
  sale: 'Sale',
};
export const SOURCE_LABELS: Record<PartSource, string> = {
  new: 'New',
  used: 'Used',
  reconditioned: 'Reconditioned',
  reused: 'Reused',
  made: 'Made',
};
export const STATUS_LABELS: Record<PartStatus, string> = {
  needed: 'Still needed',
  'on-order': 'On order',
  arrived: 'Arrived',
  fitted: 'Fitted',
  returned: 'Returned',
};
/** On order in brass text (LOOK.md "Parts table"); the rest quiet. */
export const STATUS_TONE: Record<PartStatus, string> = {
  needed: 'text-oxide-2',
  'on-order': 'text-brass-text',
  arrived: 'text-ink-2',
  fitted: 'text-gauge',
  returned: 'text-slate line-through',
};
