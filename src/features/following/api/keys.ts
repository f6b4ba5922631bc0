/** Query-key factory for following, notifications and notice preferences (all per signed-in person). */
export const followingKeys = {
  following: () => ['following'] as const,
  notifications: () => ['notifications'] as const,
  preferences: () => ['notice-preferences'] as const,
};
