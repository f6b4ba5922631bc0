import type { BuildSystem } from '../../../shared/schemas/builds';

const MAX_KEY = 40;

/** A system key from its name ("Bodywork & paint" → "bodywork-paint"): lower-case letters, digits, dashes. */
export function keyFromName(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, MAX_KEY)
    .replace(/-+$/, '');
  return base || 'system';
}

/** `keyFromName`, made unique among `taken` with a numeric suffix ("cooling-2"). */
export function uniqueKey(name: string, taken: ReadonlySet<string>): string {
  const base = keyFromName(name);
  if (!taken.has(base)) return base;
  for (let n = 2; ; n += 1) {
    const suffix = `-${n}`;
    const candidate = `${base.slice(0, MAX_KEY - suffix.length).replace(/-+$/, '')}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/** A copy of the systems list, so the form never edits the shared default list. */
export function copySystems(systems: ReadonlyArray<BuildSystem>): BuildSystem[] {
  return systems.map((s) => ({ key: s.key, name: s.name, safetyCritical: s.safetyCritical }));
}
