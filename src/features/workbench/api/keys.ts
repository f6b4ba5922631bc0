/** Query-key factory for the Workbench: one answer per signed-in person (the session decides whose). */
export const workbenchKeys = {
  all: ['workbench'] as const,
  current: () => [...workbenchKeys.all, 'current'] as const,
};
