// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import { CHECK_INBOX_MESSAGE } from '../features/accounts/components/sign-in-form';
import { createApiClient } from '../lib/api-client';
import { ApiProvider } from '../lib/api-context';
import { SignInPage } from './sign-in';

interface Call {
  method: string;
  url: string;
  body: unknown;
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

function renderSignIn(url: string, answerLink: () => Response = () => json(202, { ok: true })) {
  const calls: Call[] = [];
  const fakeFetch: typeof fetch = async (input, init) => {
    const call = { method: init?.method ?? 'GET', url: String(input), body: typeof init?.body === 'string' ? JSON.parse(init.body) : null };
    calls.push(call);
    if (call.url === '/api/session') return json(200, { account: null });
    if (call.url === '/api/csrf-token') return json(200, { token: 'csrf-token-value' });
    if (call.url === '/api/sign-in-links') return answerLink();
    return json(404, { error: { code: 'not_found', message: 'Not found' } });
  };
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter([{ path: '/sign-in', element: <SignInPage /> }], { initialEntries: [url] });
  render(
    <QueryClientProvider client={queryClient}>
      <ApiProvider client={createApiClient({ fetch: fakeFetch })}>
        <RouterProvider router={router} />
      </ApiProvider>
    </QueryClientProvider>,
  );
  return { calls };
}

afterEach(() => {
  cleanup();
});

describe('SignInPage', () => {
  it('sends a sign-in link request and answers with the same neutral message whatever the address', async () => {
    const { calls } = renderSignIn('/sign-in?returnTo=/builds/moss-garage/alderton-175');
    fireEvent.input(screen.getByLabelText('E-mail address'), { target: { value: 'Ida@Example.test' } });
    fireEvent.click(screen.getByRole('button', { name: 'E-mail me a sign-in link' }));

    expect(await screen.findByText(CHECK_INBOX_MESSAGE)).toBeTruthy();
    const request = calls.find((c) => c.url === '/api/sign-in-links');
    // The shared schema lower-cases the address; the return path travels with the request.
    expect(request).toEqual({
      method: 'POST',
      url: '/api/sign-in-links',
      body: { email: 'ida@example.test', returnTo: '/builds/moss-garage/alderton-175' },
    });
    expect(screen.queryByText(/no account/i)).toBeNull();
  });

  it('shows a field error for a bad address and sends nothing', async () => {
    const { calls } = renderSignIn('/sign-in');
    const input = screen.getByLabelText('E-mail address');
    fireEvent.input(input, { target: { value: 'not-an-address' } });
    fireEvent.click(screen.getByRole('button', { name: 'E-mail me a sign-in link' }));

    expect(await screen.findByText('Must be an e-mail address')).toBeTruthy();
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toContain(screen.getByText('Must be an e-mail address').id);
    expect(calls.some((c) => c.url === '/api/sign-in-links')).toBe(false);
  });

  it('says when too many links were asked for', async () => {
    renderSignIn(
      '/sign-in',
      () =>
        new Response(JSON.stringify({ error: { code: 'rate_limited', message: 'Too many requests' } }), {
          status: 429,
          headers: { 'content-type': 'application/json', 'retry-after': '300' },
        }),
    );
    fireEvent.input(screen.getByLabelText('E-mail address'), { target: { value: 'ida@example.test' } });
    fireEvent.click(screen.getByRole('button', { name: 'E-mail me a sign-in link' }));
    expect((await screen.findByRole('alert')).textContent).toBe('Too many sign-in links were asked for. Try again in 5 minutes.');
  });

  it('keeps a safe returnTo for GitHub and falls back to the front page for another site', () => {
    renderSignIn('/sign-in?returnTo=/account');
    expect(screen.getByRole('link', { name: 'Continue with GitHub' }).getAttribute('href')).toBe('/auth/github?returnTo=/account');
    cleanup();
    renderSignIn('/sign-in?returnTo=//evil.example/path');
    expect(screen.getByRole('link', { name: 'Continue with GitHub' }).getAttribute('href')).toBe('/auth/github?returnTo=/');
  });

  it('explains why GitHub sent the reader back', () => {
    renderSignIn('/sign-in?error=suspended');
    expect(screen.getByRole('alert').textContent).toMatch(/suspended/);
  });
});
