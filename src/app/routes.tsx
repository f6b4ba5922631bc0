import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router';
import { latestEpisodesOptions } from '../features/episodes/api/get-latest-episodes';
import type { ApiClient } from '../lib/api-client';
import { AccountBuildsPage } from '../routes/account-builds';
import { AccountSettingsPage } from '../routes/account-settings';
import { adminAccountsLoader, AdminAccountsPage } from '../routes/admin-accounts';
import { adminSponsorLoader, AdminSponsorPage } from '../routes/admin-sponsor';
import { adminSponsorsLoader, AdminSponsorsPage } from '../routes/admin-sponsors';
import { adminSuppliersLoader, AdminSuppliersPage } from '../routes/admin-suppliers';
import { buildPageLoader, BuildPage } from '../routes/build-page';
import { buildsDirectoryLoader, BuildsDirectoryPage } from '../routes/builds-directory';
import { buildTeamLoader, BuildTeamPage } from '../routes/build-team';
import { creatorPageLoader, CreatorPage } from '../routes/creator-page';
import { episodePageLoader, EpisodePage } from '../routes/episode-page';
import { followingLoader, FollowingPage } from '../routes/following';
import { FrontPage, frontPageQuery } from '../routes/front-page';
import { inboxLoader, InboxPage } from '../routes/inbox';
import { moderationQueueLoader, ModerationQueuePage } from '../routes/moderation-queue';
import { noticeSettingsLoader, NoticeSettingsPage } from '../routes/notice-settings';
import { notificationsLoader, NotificationsPage } from '../routes/notifications';
import { InvitationAcceptPage } from '../routes/invitation-accept';
import { NotFound } from '../routes/not-found';
import { primeSession, requireAccount } from '../routes/route-guards';
import { searchPageLoader, SearchPage } from '../routes/search-page';
import { sponsorSummaryLoader, SponsorSummaryPage } from '../routes/sponsor-summary';
import { teamSponsorSummaryLoader, TeamSponsorSummaryPage } from '../routes/team-sponsor-summary';
import { SignInPage } from '../routes/sign-in';
import { SignInLinkPage } from '../routes/sign-in-link';
import { workbenchLoader, WorkbenchPage } from '../routes/workbench';
import { WorkshopPage } from '../routes/workshop';
import { workbenchBuildLoader, WorkbenchBuildPage } from '../routes/workbench-build';
import { buildLedgerLoader, BuildLedgerPage } from '../routes/workbench-build-ledger';
import { NewBuildPage } from '../routes/workbench-build-new';
import { buildSettingsLoader, BuildSettingsPage } from '../routes/workbench-build-settings';
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
            await queryClient.ensureQueryData(latestEpisodesOptions(api, q));
            return null;
          },
          Component: FrontPage,
        },
        { path: 'builds', id: 'builds-directory', loader: buildsDirectoryLoader(deps), Component: BuildsDirectoryPage },
        { path: 'builds/:handle/:buildSlug', id: 'build-page', loader: buildPageLoader(deps), Component: BuildPage },
        {
          path: 'builds/:handle/:buildSlug/episodes/:episodeSlug',
          id: 'episode-page',
          loader: episodePageLoader(deps),
          Component: EpisodePage,
        },
        { path: 'creators/:handle', id: 'creator-page', loader: creatorPageLoader(deps), Component: CreatorPage },
        { path: 'search', id: 'search', loader: searchPageLoader(deps), Component: SearchPage },
        { path: 'sign-in', id: 'sign-in', Component: SignInPage },
        { path: 'sign-in/link', id: 'sign-in-link', Component: SignInLinkPage },
        { path: 'invitations/accept', id: 'invitation-accept', Component: InvitationAcceptPage },
        { path: 'account', id: 'account-settings', loader: signedIn, Component: AccountSettingsPage },
        { path: 'account/builds', id: 'account-builds', loader: signedIn, Component: AccountBuildsPage },
        { path: 'account/builds/:buildId/team', id: 'build-team', loader: buildTeamLoader(deps), Component: BuildTeamPage },
        { path: 'workbench', id: 'workbench', loader: workbenchLoader(deps), Component: WorkbenchPage },
        { path: 'workbench/builds/new', id: 'workbench-build-new', loader: signedIn, Component: NewBuildPage },
        { path: 'workbench/builds/:buildId', id: 'workbench-build', loader: workbenchBuildLoader(deps), Component: WorkbenchBuildPage },
        {
          path: 'workbench/builds/:buildId/settings',
          id: 'workbench-build-settings',
          loader: buildSettingsLoader(deps),
          Component: BuildSettingsPage,
        },
        {
          path: 'workbench/builds/:buildId/ledger',
          id: 'workbench-build-ledger',
          loader: buildLedgerLoader(deps),
          Component: BuildLedgerPage,
        },
        {
          path: 'workbench/builds/:buildId/sponsors/:sponsorId',
          id: 'team-sponsor-summary',
          loader: teamSponsorSummaryLoader(deps),
          Component: TeamSponsorSummaryPage,
        },
        { path: 'sponsors/:slug', id: 'sponsor-summary', loader: sponsorSummaryLoader(deps), Component: SponsorSummaryPage },
        // A lazy module (the editor and Tiptap load only here); it reads its data through hooks, so the
        // loader only sends visitors to sign in.
        {
          path: 'workbench/episodes/:episodeId/edit',
          id: 'episode-editor',
          loader: signedIn,
          lazy: () => import('../routes/episode-editor'),
        },
        { path: 'inbox', id: 'inbox', loader: inboxLoader(deps), Component: InboxPage },
        { path: 'following', id: 'following', loader: followingLoader(deps), Component: FollowingPage },
        { path: 'notifications', id: 'notifications', loader: notificationsLoader(deps), Component: NotificationsPage },
        { path: 'account/notices', id: 'notice-settings', loader: noticeSettingsLoader(deps), Component: NoticeSettingsPage },
        { path: 'moderation', id: 'moderation-queue', loader: moderationQueueLoader(deps), Component: ModerationQueuePage },
        { path: 'admin/accounts', id: 'admin-accounts', loader: adminAccountsLoader(deps), Component: AdminAccountsPage },
        { path: 'workshop', id: 'workshop', Component: WorkshopPage },
        { path: 'admin/suppliers', id: 'admin-suppliers', loader: adminSuppliersLoader(deps), Component: AdminSuppliersPage },
        { path: 'admin/sponsors', id: 'admin-sponsors', loader: adminSponsorsLoader(deps), Component: AdminSponsorsPage },
        { path: 'admin/sponsors/:sponsorId', id: 'admin-sponsor', loader: adminSponsorLoader(deps), Component: AdminSponsorPage },
        { path: '*', id: NOT_FOUND_ROUTE_ID, Component: NotFound },
      ],
    },
  ];
}
