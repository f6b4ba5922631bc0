// Build constants without the build schemas (src/shared/schemas/builds.ts), for code that must not
// load zod: the public reading pages.

/** The vehicle systems every new build starts with (DESIGN.md), and which are safety-critical. */
export const DEFAULT_SYSTEMS: ReadonlyArray<{ key: string; name: string; safetyCritical: boolean }> = [
  { key: 'cooling', name: 'Cooling', safetyCritical: true },
  { key: 'fuel', name: 'Fuel', safetyCritical: true },
  { key: 'brakes', name: 'Brakes', safetyCritical: true },
  { key: 'electrical', name: 'Electrical', safetyCritical: true },
  { key: 'engine', name: 'Engine', safetyCritical: false },
  { key: 'transmission', name: 'Transmission', safetyCritical: false },
  { key: 'suspension', name: 'Suspension', safetyCritical: true },
  { key: 'steering', name: 'Steering', safetyCritical: true },
  { key: 'body', name: 'Body', safetyCritical: false },
  { key: 'interior', name: 'Interior', safetyCritical: false },
];

export const VEHICLE_KINDS = ['car', 'motorcycle', 'tractor', 'boat', 'other'] as const;
export const VISIBILITIES = ['public', 'unlisted', 'private'] as const;

/** The video link pattern of a build that has not set one (see videoLinkPattern in the schemas). */
export const DEFAULT_VIDEO_LINK_PATTERN = 't={seconds}';
