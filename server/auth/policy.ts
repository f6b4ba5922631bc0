import type { BuildVisibility, EpisodeStatus } from '../db/database';
import { HttpError } from '../http/http-error';
import type { Actor, SignedIn } from './actor';

export type { Actor } from './actor';

/** What an action is about, loaded by the route before the policy decides. */
export type Resource =
  | {
      kind: 'build';
      id: number;
      visibility: BuildVisibility;
      deleted: boolean;
      pendingTransferTo: number | null;
      /** The build's `content_revision` when it was loaded: the key of its cached public reads. */
      contentRevision?: number;
    }
  | {
      kind: 'episode';
      id: number;
      buildId: number;
      visibility: BuildVisibility;
      status: EpisodeStatus;
      deleted: boolean;
      /** The build's `content_revision` when it was loaded: the key of its cached public reads. */
      contentRevision?: number;
    }
  | { kind: 'account'; userId: number }
  /** A sponsor organisation as its summary sees it: only its members know it is there (404 to others). */
  | { kind: 'sponsor'; id: number }
  | {
      kind: 'post';
      id: number;
      episodeId: number;
      buildId: number;
      visibility: BuildVisibility;
      status: EpisodeStatus;
      deleted: boolean;
      authorId: number;
      hidden: boolean;
    };

type Rule = {
  /** Visitors get 401 (sign in) rather than 403 when denied. */
  signedIn: boolean;
  allow: (actor: Actor, resource: Resource | undefined) => boolean;
};

const role = (actor: Actor, buildId: number) => actor?.builds.get(buildId);
/** The build a build or episode resource belongs to. */
const buildOf = (r: Resource | undefined): number | undefined =>
  r?.kind === 'build' ? r.id : r?.kind === 'episode' || r?.kind === 'post' ? r.buildId : undefined;
const isTeam = (actor: Actor, r: Resource | undefined) => {
  const b = buildOf(r);
  return b !== undefined && role(actor, b) !== undefined;
};
const isOwner = (actor: Actor, r: Resource | undefined) => {
  const b = buildOf(r);
  return b !== undefined && role(actor, b) === 'owner';
};

/**
 * The one table of who may do what (DESIGN.md, "People and roles"). Routes name an action in
 * the route registry; nothing else decides permissions.
 */
const rules = {
  'site.read': { signedIn: false, allow: () => true },
  'account.self': { signedIn: true, allow: (a) => a !== null },
  'build.create': { signedIn: true, allow: (a) => a !== null },
  'build.read': { signedIn: false, allow: () => true },
  'build.manage': { signedIn: true, allow: isOwner },
  'build.transfer.accept': { signedIn: true, allow: (a, r) => r?.kind === 'build' && a !== null && r.pendingTransferTo === a.userId },
  'episode.read': { signedIn: false, allow: () => true },
  'episode.write': { signedIn: true, allow: isTeam },
  'episode.delete': { signedIn: true, allow: isOwner },
  'build.team.read': { signedIn: true, allow: isTeam },
  'build.team.manage': { signedIn: true, allow: isOwner },
  'admin.accounts': { signedIn: true, allow: (a) => a?.isAdmin === true },
  'admin.suppliers': { signedIn: true, allow: (a) => a?.isAdmin === true },
  // Followers: anyone signed in follows, posts, replies and reports; authors edit and delete their
  // own; the build team answers and sets states; the build team and admins hide and restore.
  follow: { signedIn: true, allow: (a) => a !== null },
  'post.create': { signedIn: true, allow: (a) => a !== null },
  'post.report': { signedIn: true, allow: (a) => a !== null },
  'post.author': { signedIn: true, allow: (a, r) => a !== null && r?.kind === 'post' && r.authorId === a.userId },
  'post.answer': { signedIn: true, allow: isTeam },
  'post.moderate': { signedIn: true, allow: (a, r) => a?.isAdmin === true || isTeam(a, r) },
  'admin.moderation': { signedIn: true, allow: (a) => a?.isAdmin === true },
  // Sponsors: admins keep the organisations; a member reads its own organisation's summary (the
  // resource is hidden from everyone else, admins included, so they get 404).
  'admin.sponsors': { signedIn: true, allow: (a) => a?.isAdmin === true },
  'sponsor.summary.read': { signedIn: true, allow: (a, r) => r?.kind === 'sponsor' && a?.sponsors.has(r.id) === true },
} satisfies Record<string, Rule>;

export type PolicyAction = keyof typeof rules;
export const policyActions = Object.keys(rules) as PolicyAction[];

/** Actions open to visitors (what they are about may still be hidden from them). */
export function isPublicAction(action: PolicyAction): boolean {
  return !(rules[action] as Rule).signedIn;
}

/** May the actor see this resource exists at all? Hidden ones answer 404, never 401/403. */
export function canSee(actor: Actor, resource: Resource | undefined): boolean {
  if (!resource || resource.kind === 'account') return true;
  if (resource.kind === 'sponsor') return actor?.sponsors.has(resource.id) === true;
  // Deleted things stay visible to their owner only, for the 30 days they can be restored.
  if (resource.deleted) return isOwner(actor, resource);
  if (isTeam(actor, resource)) return true;
  if ((resource.kind === 'episode' || resource.kind === 'post') && resource.status !== 'published') return false;
  // A hidden post vanishes for everyone but its author, the build team (above) and admins.
  if (resource.kind === 'post' && resource.hidden && actor?.userId !== resource.authorId && actor?.isAdmin !== true) return false;
  return resource.visibility !== 'private';
}

/** True when the actor may perform the action on the resource. */
export function can(actor: Actor, action: PolicyAction, resource?: Resource): boolean {
  return canSee(actor, resource) && (rules[action] as Rule).allow(actor, resource);
}

/** Throws 404 for a hidden resource, 401 for a visitor where sign-in is needed, 403 otherwise. */
export function authorize(actor: Actor, action: PolicyAction, resource?: Resource): asserts actor is SignedIn | null {
  if (!canSee(actor, resource)) throw new HttpError(404, 'not_found', 'Not found');
  const rule: Rule = rules[action];
  if (rule.allow(actor, resource)) return;
  if (!actor && rule.signedIn) throw new HttpError(401, 'unauthenticated', 'Sign in to do this');
  throw new HttpError(403, 'forbidden', 'You may not do this');
}

/** For handlers of signed-in actions: the actor, typed as signed in. */
export function signedIn(actor: Actor): SignedIn {
  if (!actor) throw new HttpError(401, 'unauthenticated', 'Sign in to do this');
  return actor;
}
