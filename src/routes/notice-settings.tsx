import { PageHeading } from '../components/ui/page-heading';
import { QueryState } from '../components/ui/query-state';
import { useSession } from '../features/accounts/api/get-session';
import { noticePreferencesOptions, useNoticePreferences } from '../features/following/api/queries';
import { NoticePreferencesForm } from '../features/following/components/notice-preferences-form';
import { requireAccount, rethrowAsRouteError, type LoaderDeps } from './route-guards';

export function noticeSettingsLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    await deps.queryClient.ensureQueryData(noticePreferencesOptions(deps.api)).catch(rethrowAsRouteError);
    return null;
  };
}

/** The preferences page every notice e-mail links to. */
export function NoticeSettingsPage() {
  const { data, error, refetch, isFetching } = useNoticePreferences();
  const { data: session } = useSession();
  return (
    <>
      <title>Notice settings — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Your account" title="Notice settings">
        What we e-mail you. Every notice also shows under Notifications; every e-mail has a one-click unsubscribe.
      </PageHeading>
      {data ? (
        <NoticePreferencesForm initial={data} onTeam={(session?.account?.builds.length ?? 0) > 0} />
      ) : (
        <QueryState
          error={error}
          isFetching={isFetching}
          refetch={refetch}
          errorTitle="Your settings could not be loaded."
          loadingTitle="Loading…"
        />
      )}
    </>
  );
}
