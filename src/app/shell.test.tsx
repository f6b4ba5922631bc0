// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import { createApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';
import type { Account } from '../shared/schemas/accounts';
import { SiteHeader } from './shell';

function account(overrides: Partial<Account> = {}): Account {
  return {
    id: 3,
    handle: 'iron-ida',
    displayName: 'Ida Ironside',
    avatarUrl: null,
    email: 'ida@example.test',
    noticeEmail: null,
    isAdmin: false,
    signInMethods: ['github'],
    builds: [],
    sponsors: [],
    ...overrides,
  };
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

function renderHeader(signedIn: Account | null, url = '/builds/moss-garage/alderton-175?tab=parts') {
  const calls: string[] = [];
  const fakeFetch: typeof fetch = async (input, init) => {
    calls.push(`${init?.method ?? 'GET'} ${String(input)}`);
    if (String(input) === '/api/session') return json(200, { account: signedIn });
    if (String(input) === '/api/csrf-token') return json(200, { token: 'csrf-token-value' });
    if (String(input) === '/api/session/sign-out') return new Response(null, { status: 204 });
    return json(404, { error: { code: 'not_found', message: 'Not found' } });
  };
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter([{ path: '*', element: <SiteHeader /> }], { initialEntries: [url] });
  render(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={createApiClient({ fetch: fakeFetch })}>
        <RouterProvider router={router} />
      </ApiProvider>
    </QueryClientProvider>,
  );
  return { calls, router, queryClient };
}

afterEach(() => {
  cleanup();
});

describe('SiteHeader account menu', () => {
  it('offers "Sign in" to a visitor, coming back to the page they are on', async () => {
    renderHeader(null);
    const link = await screen.findByRole('link', { name: 'Sign in' });
    expect(link.getAttribute('href')).toBe('/sign-in?returnTo=/builds/moss-garage/alderton-175%3Ftab%3Dparts');
    expect(screen.queryByRole('button', { expanded: false })).toBeNull();
  });

  it('shows an admin the Accounts entry, and closes on Escape', async () => {
    renderHeader(account({ isAdmin: true }));
    const button = await screen.findByRole('button', { name: /Ida Ironside/ });
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(screen.queryByRole('link', { name: 'Accounts' })).toBeNull();

    fireEvent.click(button);
    expect(button.getAttribute('aria-expanded')).toBe('true');
    const list = document.getElementById(button.getAttribute('aria-controls')!)!;
    expect(within(list).getByRole('link', { name: 'Accounts' }).getAttribute('href')).toBe('/admin/accounts');
    expect(within(list).getByRole('link', { name: 'Account settings' }).getAttribute('href')).toBe('/account');
    expect(within(list).getByRole('button', { name: 'Sign out' })).toBeTruthy();
    // No owned build: no Build teams entry.
    expect(within(list).queryByRole('link', { name: 'Build teams' })).toBeNull();

    fireEvent.keyDown(within(list).getByRole('link', { name: 'Accounts' }), { key: 'Escape' });
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(document.activeElement).toBe(button);
  });

  it('does not show Accounts to a non-admin; an owner gets Build teams', async () => {
    renderHeader(account({ builds: [{ buildId: 7, buildTitle: '1968 Alderton 175 Trail', buildSlug: 'alderton-175', role: 'owner' }] }));
    fireEvent.click(await screen.findByRole('button', { name: /Ida Ironside/ }));
    expect(screen.queryByRole('link', { name: 'Accounts' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Build teams' }).getAttribute('href')).toBe('/account/builds');
    expect(screen.getByText('II')).toBeTruthy();
  });

  it('closes on a click outside', async () => {
    renderHeader(account());
    const button = await screen.findByRole('button', { name: /Ida Ironside/ });
    fireEvent.click(button);
    expect(button.getAttribute('aria-expanded')).toBe('true');
    fireEvent.pointerDown(document.body);
    expect(button.getAttribute('aria-expanded')).toBe('false');
  });

  it('signs out with a POST carrying the CSRF token, then shows Sign in', async () => {
    const { calls } = renderHeader(account(), '/account');
    fireEvent.click(await screen.findByRole('button', { name: /Ida Ironside/ }));
    fireEvent.click(screen.getByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('link', { name: 'Sign in' })).toBeTruthy();
    expect(calls).toContain('GET /api/csrf-token');
    expect(calls).toContain('POST /api/session/sign-out');
  });
});
