// Whether an episode shows the caution bar (DESIGN.md "Safety"), and its words. One pure function
// so the editor, the reading pages and later issues (parts, figures) agree on the answer.

export type CautionReason = { kind: 'raised-vehicle' } | { kind: 'system'; key: string; name: string };
export type CautionSystem = { key: string; name: string; safetyCritical: boolean };

/**
 * The caution is needed when the episode is marked "work under a raised vehicle" or touches a
 * safety-critical system of the build. `systemKeys` is the union of the keys its chapters (and,
 * later, parts and figures) name; keys the build does not have are ignored. Reasons come in the
 * build's system order, the raised vehicle first.
 */
export function needsCaution(
  episode: { raisedVehicle: boolean; systemKeys: readonly string[] },
  systems: readonly CautionSystem[],
): { needed: boolean; reasons: CautionReason[] } {
  const touched = new Set(episode.systemKeys);
  const reasons: CautionReason[] = episode.raisedVehicle ? [{ kind: 'raised-vehicle' }] : [];
  for (const s of systems) {
    if (s.safetyCritical && touched.has(s.key)) reasons.push({ kind: 'system', key: s.key, name: s.name });
  }
  return { needed: reasons.length > 0, reasons };
}

const DEFER = "follow the vehicle's workshop manual, local regulations and licensed practice";

/** One plain sentence per reason, in the same order; the product never vouches for a figure. */
export function cautionText(reasons: readonly CautionReason[]): string[] {
  return reasons.map((r) => {
    if (r.kind === 'raised-vehicle') {
      // Common practice; stated on its own because a falling vehicle is the worst case.
      return 'This episode shows work under a raised vehicle: support it on stands rated for its weight, on firm level ground, and never work under it on a jack alone.';
    }
    if (r.key === 'cooling') {
      // REFERENCES.md "Safety cautions": pressurised caps (workshop guidance), poisonous coolant (US EPA, ATSDR).
      return `This episode touches the cooling system, which is safety-critical: never open the radiator or expansion-tank cap on a hot engine, as the system is under pressure; coolant is poisonous and tastes sweet to children and pets, so wipe up spills and take it to a proper disposal point; ${DEFER}.`;
    }
    return `This episode touches ${r.name}, a safety-critical system: what is shown here was done on one vehicle, so ${DEFER} for yours.`;
  });
}
