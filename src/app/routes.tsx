import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { latestEpisodesOptions } from '../features/episodes/api/get-latest-episodes';
import type { ApiClient } from '../lib/api-client';
import { FrontPage, frontPageQuery } from '../routes/front-page';
import { NotFound } from '../routes/not-found';
import { needData } from '../routes/reading-loaders';
import { primeSession, requireAccount } from '../routes/route-guards';
import { RouteErrorBoundary } from './error-boundary';
import { Shell, ShellLoading } from './shell';

/** The catch-all route; the server answers 404 when it matches. */
export const NOT_FOUND_ROUTE_ID = 'not-found';

export interface RouteDeps {
  queryClient: QueryClient;
  api: ApiClient;
}

/**
 * The one route tree, used by the browser router and by the server's static handler.
 * Loaders only prime the query cache; components read it with the same query options.
 */
export function createRoutes({ queryClient, api }: RouteDeps): RouteObject[] {
  const deps = { queryClient, api };
  const signedIn = async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    return null;
  };
  return [
    {
      id: 'root',
      path: '/',
      // The header knows who is signed in already in the server's HTML.
      loader: async () => {
        await primeSession(deps);
        return null;
      },
      Component: Shell,
      // Only when the browser renders without server HTML (npm run dev): the header waits for the session.
      HydrateFallback: ShellLoading,
      ErrorBoundary: RouteErrorBoundary,
      children: [
        {
          index: true,
          id: 'front-page',
          loader: async ({ request }) => {
            const q = frontPageQuery(new URL(request.url).searchParams);
            await needData(queryClient.ensureQueryData(latestEpisodesOptions(api, q)));
            return null;
          },
          Component: FrontPage,
        },
        {
          path: 'builds',
          id: 'builds-directory',
          lazy: async () => {
            const m = await import('../routes/builds-directory');
            return { loader: m.buildsDirectoryLoader(deps), Component: m.BuildsDirectoryPage };
          },
        },
        {
          path: 'builds/:handle/:buildSlug',
          id: 'build-page',
          lazy: async () => {
            const m = await import('../routes/build-page');
            return { loader: m.buildPageLoader(deps), Component: m.BuildPage };
          },
        },
        {
          path: 'builds/:handle/:buildSlug/episodes/:episodeSlug',
          id: 'episode-page',
          lazy: async () => {
            const m = await import('../routes/episode-page');
            return { loader: m.episodePageLoader(deps), Component: m.EpisodePage };
          },
        },
        {
          path: 'creators/:handle',
          id: 'creator-page',
          lazy: async () => {
            const m = await import('../routes/creator-page');
            return { loader: m.creatorPageLoader(deps), Component: m.CreatorPage };
          },
        },
        {
          path: 'search',
          id: 'search',
          lazy: async () => {
            const m = await import('../routes/search-page');
            return { loader: m.searchPageLoader(deps), Component: m.SearchPage };
          },
        },
        {
          path: 'sign-in',
          id: 'sign-in',
          lazy: async () => ({ Component: (await import('../routes/sign-in')).SignInPage }),
        },
        {
          path: 'sign-in/link',
          id: 'sign-in-link',
          lazy: async () => ({ Component: (await import('../routes/sign-in-link')).SignInLinkPage }),
        },
        {
          path: 'invitations/accept',
          id: 'invitation-accept',
          lazy: async () => ({ Component: (await import('../routes/invitation-accept')).InvitationAcceptPage }),
        },
        {
          path: 'account',
          id: 'account-settings',
          loader: signedIn,
          lazy: async () => ({ Component: (await import('../routes/account-settings')).AccountSettingsPage }),
        },
        {
          path: 'account/builds',
          id: 'account-builds',
          loader: signedIn,
          lazy: async () => ({ Component: (await import('../routes/account-builds')).AccountBuildsPage }),
        },
        {
          path: 'account/builds/:buildId/team',
          id: 'build-team',
          lazy: async () => {
            const m = await import('../routes/build-team');
            return { loader: m.buildTeamLoader(deps), Component: m.BuildTeamPage };
          },
        },
        {
          path: 'workbench',
          id: 'workbench',
          lazy: async () => {
            const m = await import('../routes/workbench');
            return { loader: m.workbenchLoader(deps), Component: m.WorkbenchPage };
          },
        },
        {
          path: 'workbench/builds/new',
          id: 'workbench-build-new',
          loader: signedIn,
          lazy: async () => ({ Component: (await import('../routes/workbench-build-new')).NewBuildPage }),
        },
        {
          path: 'workbench/builds/:buildId',
          id: 'workbench-build',
          lazy: async () => {
            const m = await import('../routes/workbench-build');
            return { loader: m.workbenchBuildLoader(deps), Component: m.WorkbenchBuildPage };
          },
        },
        {
          path: 'workbench/builds/:buildId/settings',
          id: 'workbench-build-settings',
          lazy: async () => {
            const m = await import('../routes/workbench-build-settings');
            return { loader: m.buildSettingsLoader(deps), Component: m.BuildSettingsPage };
          },
        },
        {
          path: 'workbench/builds/:buildId/ledger',
          id: 'workbench-build-ledger',
          lazy: async () => {
            const m = await import('../routes/workbench-build-ledger');
            return { loader: m.buildLedgerLoader(deps), Component: m.BuildLedgerPage };
          },
        },
        {
          path: 'workbench/builds/:buildId/sponsors/:sponsorId',
          id: 'team-sponsor-summary',
          lazy: async () => {
            const m = await import('../routes/team-sponsor-summary');
            return { loader: m.teamSponsorSummaryLoader(deps), Component: m.TeamSponsorSummaryPage };
          },
        },
        {
          path: 'sponsors/:slug',
          id: 'sponsor-summary',
          lazy: async () => {
            const m = await import('../routes/sponsor-summary');
            return { loader: m.sponsorSummaryLoader(deps), Component: m.SponsorSummaryPage };
          },
        },
        // A lazy module (the editor and Tiptap load only here); it reads its data through hooks, so the
        // loader only sends visitors to sign in.
        {
          path: 'workbench/episodes/:episodeId/edit',
          id: 'episode-editor',
          loader: signedIn,
          lazy: () => import('../routes/episode-editor'),
        },
        {
          path: 'inbox',
          id: 'inbox',
          lazy: async () => {
            const m = await import('../routes/inbox');
            return { loader: m.inboxLoader(deps), Component: m.InboxPage };
          },
        },
        {
          path: 'following',
          id: 'following',
          lazy: async () => {
            const m = await import('../routes/following');
            return { loader: m.followingLoader(deps), Component: m.FollowingPage };
          },
        },
        {
          path: 'notifications',
          id: 'notifications',
          lazy: async () => {
            const m = await import('../routes/notifications');
            return { loader: m.notificationsLoader(deps), Component: m.NotificationsPage };
          },
        },
        {
          path: 'account/notices',
          id: 'notice-settings',
          lazy: async () => {
            const m = await import('../routes/notice-settings');
            return { loader: m.noticeSettingsLoader(deps), Component: m.NoticeSettingsPage };
          },
        },
        {
          path: 'moderation',
          id: 'moderation-queue',
          lazy: async () => {
            const m = await import('../routes/moderation-queue');
            return { loader: m.moderationQueueLoader(deps), Component: m.ModerationQueuePage };
          },
        },
        {
          path: 'admin/accounts',
          id: 'admin-accounts',
          lazy: async () => {
            const m = await import('../routes/admin-accounts');
            return { loader: m.adminAccountsLoader(deps), Component: m.AdminAccountsPage };
          },
        },
        {
          path: 'workshop',
          id: 'workshop',
          lazy: async () => ({ Component: (await import('../routes/workshop')).WorkshopPage }),
        },
        {
          path: 'admin/suppliers',
          id: 'admin-suppliers',
          lazy: async () => {
            const m = await import('../routes/admin-suppliers');
            return { loader: m.adminSuppliersLoader(deps), Component: m.AdminSuppliersPage };
          },
        },
        {
          path: 'admin/sponsors',
          id: 'admin-sponsors',
          lazy: async () => {
            const m = await import('../routes/admin-sponsors');
            return { loader: m.adminSponsorsLoader(deps), Component: m.AdminSponsorsPage };
          },
        },
        {
          path: 'admin/sponsors/:sponsorId',
          id: 'admin-sponsor',
          lazy: async () => {
            const m = await import('../routes/admin-sponsor');
            return { loader: m.adminSponsorLoader(deps), Component: m.AdminSponsorPage };
          },
        },
        { path: '*', id: NOT_FOUND_ROUTE_ID, Component: NotFound },
      ],
    },
  ];
}
