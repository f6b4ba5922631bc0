import { HttpError } from '../http/http-error';

/** Who is making a request: a signed-in account, or null for a visitor. */
export type Actor = { userId: number; isAdmin: boolean } | null;

type Rule = { signedIn: boolean; allow: (actor: Actor) => boolean };

/**
 * The one table of what each action needs. Routes name an action in the route registry;
 * resource-level checks (build membership, hidden drafts) are added here by later features.
 */
const rules = {
  'site.read': { signedIn: false, allow: () => true },
  'admin.access': { signedIn: true, allow: (a) => a?.isAdmin === true },
} satisfies Record<string, Rule>;

export type PolicyAction = keyof typeof rules;
export const policyActions = Object.keys(rules) as PolicyAction[];

/** True when the actor may perform the action. */
export function can(actor: Actor, action: PolicyAction): boolean {
  return rules[action].allow(actor);
}

/** Throws 401 for a visitor where sign-in is needed, 403 when signed in but not allowed. */
export function authorize(actor: Actor, action: PolicyAction): void {
  const rule: Rule = rules[action];
  if (rule.allow(actor)) return;
  if (!actor && rule.signedIn) throw new HttpError(401, 'unauthenticated', 'Sign in to do this');
  throw new HttpError(403, 'forbidden', 'You may not do this');
}
