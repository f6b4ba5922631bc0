import type { AdminAccount, AdminAccountAction } from '../../../shared/schemas/accounts';

export interface ActionCopy {
  /** The row button's visible text. */
  label: string;
  title: (a: AdminAccount) => string;
  body: string;
  confirm: string;
  /** Taking something away is 'danger'; giving it back is not. */
  tone: 'danger' | 'primary';
}

/** What each admin action is called and what its confirmation says will happen. */
export const actionCopy: Record<AdminAccountAction, ActionCopy> = {
  suspend: {
    label: 'Suspend',
    title: (a) => `Suspend ${a.displayName} (@${a.handle})?`,
    body: 'They are signed out everywhere and cannot sign in until an admin restores the account. What they wrote stays up.',
    confirm: 'Suspend account',
    tone: 'danger',
  },
  restore: {
    label: 'Restore',
    title: (a) => `Restore ${a.displayName} (@${a.handle})?`,
    body: 'They can sign in again, with the builds and memberships they had.',
    confirm: 'Restore account',
    tone: 'primary',
  },
  'grant-admin': {
    label: 'Grant admin',
    title: (a) => `Make ${a.displayName} (@${a.handle}) an admin?`,
    body: 'Admins work the moderation queue and this accounts list, and can suspend accounts. They still cannot read drafts, private builds or receipts.',
    confirm: 'Grant admin',
    tone: 'primary',
  },
  'revoke-admin': {
    label: 'Revoke admin',
    title: (a) => `Take admin away from ${a.displayName} (@${a.handle})?`,
    body: 'They keep their account and builds but lose the admin screens.',
    confirm: 'Revoke admin',
    tone: 'danger',
  },
};

/** The two actions a row offers, given its current state. */
export function rowActions(a: AdminAccount): AdminAccountAction[] {
  return [a.suspendedAt ? 'restore' : 'suspend', a.isAdmin ? 'revoke-admin' : 'grant-admin'];
}
