/** The session is its own root key, so everything else can be dropped when the person changes. */
export const sessionKeys = {
  all: ['session'] as const,
  current: () => [...sessionKeys.all, 'current'] as const,
};

/** Query-key factory for accounts, build teams and invitations: every variable a fetcher uses is in its key. */
export const accountKeys = {
  all: ['accounts'] as const,
  team: (buildId: number) => [...accountKeys.all, 'team', buildId] as const,
  members: (buildId: number) => [...accountKeys.team(buildId), 'members'] as const,
  invitations: (buildId: number) => [...accountKeys.team(buildId), 'invitations'] as const,
  invitationLookup: (token: string) => [...accountKeys.all, 'invitation-lookup', token] as const,
};
