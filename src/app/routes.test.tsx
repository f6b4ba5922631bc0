// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { Account } from '../shared/schemas/accounts';
import { json, renderApp as renderWith, type Answer } from '../routes/workbench-test-app';

const owner: Account = {
  id: 3,
  handle: 'moss-garage',
  displayName: 'Moss Garage',
  avatarUrl: null,
  email: 'moss@example.test',
  noticeEmail: null,
  isAdmin: false,
  signInMethods: ['github', 'email'],
  builds: [{ buildId: 7, buildTitle: '1968 Alderton 175 Trail', buildSlug: 'alderton-175', role: 'owner' }],
  sponsors: [],
};

/** The shared app-render helper, with the front page's list answered and calls kept as "METHOD path". */
function renderApp(url: string, signedIn: Account | null, answer: Answer = () => undefined) {
  const calls: string[] = [];
  const { router } = renderWith(url, signedIn, (method, path, body) => {
    calls.push(`${method} ${path}`);
    return (
      answer(method, path, body) ??
      (path === '/api/episodes?page=1&perPage=12' ? json(200, { items: [], page: 1, perPage: 12, total: 0 }) : undefined)
    );
  });
  return { calls, router };
}

afterEach(() => {
  cleanup();
});

describe('guarded routes', () => {
  it('sends a visitor from /account to the sign-in page that comes back', async () => {
    const { router } = renderApp('/account', null);
    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in?returnTo=/account');
  });

  it('answers a signed-in non-admin on /admin/accounts with the 403 page', async () => {
    const { calls } = renderApp('/admin/accounts', owner);
    expect(await screen.findByRole('heading', { name: 'This is not yours to change' })).toBeTruthy();
    expect(calls.some((c) => c.includes('/api/admin/'))).toBe(false);
  });

  it('answers the team page of a build the person is not on with the 404 page', async () => {
    renderApp('/account/builds/99/team', owner);
    expect(await screen.findByRole('heading', { name: 'Nothing on this bench' })).toBeTruthy();
  });

  it('shows the 401 page, with a sign-in link back, when the API says the session ended', async () => {
    renderApp('/account/builds/7/team', owner, (_m, url) =>
      url.startsWith('/api/builds/7/') ? json(401, { error: { code: 'unauthenticated', message: 'Sign in' } }) : undefined,
    );
    expect(await screen.findByRole('heading', { name: 'Sign in to continue' })).toBeTruthy();
    const main = screen.getByRole('main');
    expect(within(main).getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe('/sign-in?returnTo=/account/builds/7/team');
  });
});

describe('build team page', () => {
  const members = {
    items: [
      { userId: 3, handle: 'moss-garage', displayName: 'Moss Garage', avatarUrl: null, role: 'owner' },
      { userId: 5, handle: 'iron-ida', displayName: 'Ida Ironside', avatarUrl: null, role: 'editor' },
    ],
  };

  it('lets the owner remove an editor after a confirmation naming them', async () => {
    let removed = false;
    const { calls } = renderApp('/account/builds/7/team', owner, (method, url) => {
      if (url === '/api/builds/7/members') return json(200, removed ? { items: [members.items[0]] } : members);
      if (url === '/api/builds/7/invitations') return json(200, { items: [] });
      if (method === 'DELETE' && url === '/api/builds/7/members/5') {
        removed = true;
        return new Response(null, { status: 204 });
      }
      return undefined;
    });

    fireEvent.click(await screen.findByRole('button', { name: 'Remove Ida Ironside from the build team' }));
    const dialog = screen.getByRole('dialog', { name: 'Remove Ida Ironside from the build team?' });
    expect(within(dialog).getByText(/will no longer be able to edit 1968 Alderton 175 Trail/)).toBeTruthy();
    fireEvent.click(within(dialog).getByRole('button', { name: 'Remove editor' }));

    await waitFor(() => expect(screen.queryByText('Ida Ironside')).toBeNull());
    expect(calls).toContain('DELETE /api/builds/7/members/5');
    expect(screen.getByText('No invitations yet.')).toBeTruthy();
  });

  it('shows an editor the members read-only, without invitations', async () => {
    const editor: Account = { ...owner, builds: [{ ...owner.builds[0]!, role: 'editor' }] };
    const { calls } = renderApp('/account/builds/7/team', editor, (_m, url) =>
      url === '/api/builds/7/members' ? json(200, members) : undefined,
    );
    expect(await screen.findByText('Ida Ironside')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Remove/ })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Invitations' })).toBeNull();
    expect(calls.some((c) => c.includes('/invitations'))).toBe(false);
  });
});

const TOKEN = 'tok_0123456789abcdefghijklmnop';

describe('sign-in link page', () => {
  it('signs in only when the button is pressed, then goes back where the person was', async () => {
    let signedIn: Account | null = null;
    const { calls, router } = renderApp(`/sign-in/link#token=${TOKEN}`, null, (method, url, body) => {
      if (url === '/api/session') return json(200, { account: signedIn });
      if (method === 'POST' && url === '/api/sign-in-links/redeem') {
        expect(body).toEqual({ token: TOKEN });
        signedIn = owner;
        return json(200, { account: owner, returnTo: '/account' });
      }
      return undefined;
    });
    const button = await screen.findByRole('button', { name: 'Sign in' });
    expect(calls.some((c) => c.includes('redeem'))).toBe(false);
    fireEvent.click(button);
    expect(await screen.findByRole('heading', { level: 1, name: 'Account settings' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/account');
  });

  it('explains a used or expired link and offers a new one', async () => {
    renderApp(`/sign-in/link#token=${TOKEN}`, null, (method, url) =>
      method === 'POST' && url === '/api/sign-in-links/redeem'
        ? json(400, { error: { code: 'link_invalid', message: 'This link is no longer valid' } })
        : undefined,
    );
    fireEvent.click(await screen.findByRole('button', { name: 'Sign in' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('This sign-in link has been used or has expired.')).toBeTruthy();
    expect(within(alert).getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/sign-in');
  });

  it('says so when the address carries no token', async () => {
    renderApp('/sign-in/link', null);
    expect(await screen.findByText('This address has no sign-in token.')).toBeTruthy();
  });
});

describe('invitation accept page', () => {
  const lookup = {
    kind: 'build-editor',
    email: 'ida@example.test',
    status: 'pending',
    target: { id: 7, title: '1968 Alderton 175 Trail' },
    invitedBy: 'Moss Garage',
  };

  it('sends a visitor to sign in with the token kept in the return path', async () => {
    renderApp(`/invitations/accept#token=${TOKEN}`, null, (method, url) =>
      method === 'POST' && url === '/api/invitations/lookup' ? json(200, lookup) : undefined,
    );
    expect(await screen.findByRole('heading', { name: 'You are invited to help edit 1968 Alderton 175 Trail' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Sign in to accept' }).getAttribute('href')).toBe(
      `/sign-in?returnTo=/invitations/accept%23token%3D${TOKEN}`,
    );
  });

  it('accepts for a signed-in person and opens the team page with a notice', async () => {
    const editor: Account = { ...owner, id: 5, handle: 'iron-ida', displayName: 'Ida Ironside', builds: [] };
    let accepted = false;
    const { router } = renderApp(`/invitations/accept#token=${TOKEN}`, editor, (method, url) => {
      if (url === '/api/session')
        return json(200, { account: accepted ? { ...editor, builds: [{ ...owner.builds[0]!, role: 'editor' }] } : editor });
      if (url === '/api/invitations/lookup') return json(200, lookup);
      if (url === '/api/invitations/accept') {
        accepted = true;
        return json(200, { kind: 'build-editor', targetId: 7 });
      }
      if (url === '/api/builds/7/members') return json(200, { items: [] });
      return undefined;
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Accept' }));
    expect(await screen.findByText('You joined the build team of 1968 Alderton 175 Trail.')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/account/builds/7/team');
  });

  it('explains a revoked invitation', async () => {
    renderApp(`/invitations/accept#token=${TOKEN}`, null, (_m, url) =>
      url === '/api/invitations/lookup' ? json(200, { ...lookup, status: 'revoked' }) : undefined,
    );
    expect(await screen.findByText('This invitation was withdrawn.')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Sign in to accept' })).toBeNull();
  });
});
