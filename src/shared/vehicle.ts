import type { VEHICLE_KINDS } from './schemas/builds';

type Kind = (typeof VEHICLE_KINDS)[number];

export const VEHICLE_KIND_LABELS: Record<Kind, string> = {
  car: 'Car',
  motorcycle: 'Motorcycle',
  tractor: 'Tractor',
  boat: 'Boat',
  other: 'Other',
};

/** "1976 Marlowe Pipit", or the kind of vehicle when nothing else is known. */
export function vehicleLine(v: {
  vehicleKind: Kind;
  vehicleMake: string | null;
  vehicleModel: string | null;
  vehicleYear: string | null;
}): string {
  const text = [v.vehicleYear, v.vehicleMake, v.vehicleModel].filter(Boolean).join(' ');
  return text || VEHICLE_KIND_LABELS[v.vehicleKind];
}
