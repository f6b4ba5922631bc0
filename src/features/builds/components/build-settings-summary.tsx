import type { Build } from '../../../shared/schemas/builds';
import { formatMoney } from '../lib/money';
import { VEHICLE_KIND_LABELS } from './build-form';
import { VISIBILITY_TEXT } from './visibility-field';

/** The build's settings as text, for editors (only the owner changes them). */
export function BuildSettingsSummary({ build }: { build: Build }) {
  const vehicle = [build.vehicleMake, build.vehicleModel, build.vehicleYear].filter(Boolean).join(' ');
  const rows: Array<[string, string]> = [
    ['Title', build.title],
    ['Vehicle', `${VEHICLE_KIND_LABELS[build.vehicleKind]}${vehicle ? `: ${vehicle}` : ''}`],
    ['Currency', build.currency],
    ['Budget', build.budgetMinor === null ? 'None' : formatMoney(build.budgetMinor, build.currency)],
    ['Visibility', `${VISIBILITY_TEXT[build.visibility].label}. ${VISIBILITY_TEXT[build.visibility].explanation}`],
    ['Start-time link pattern', build.videoLinkPattern],
    ['Vehicle systems', build.systems.map((s) => (s.safetyCritical ? `${s.name} (safety-critical)` : s.name)).join(', ') || 'None'],
  ];
  return (
    <dl className="max-w-2xl divide-y divide-rule border-y border-rule bg-card">
      {rows.map(([term, value]) => (
        <div key={term} className="grid gap-1 px-4 py-2.5 sm:grid-cols-[12rem_1fr]">
          <dt className="label-condensed">{term}</dt>
          <dd className="min-w-0 break-words">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
