import { Form, useSearchParams } from 'react-router';
import { Button } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { QueryState } from '../components/ui/query-state';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { inboxOptions, useInbox } from '../features/posts/api/get-inbox';
import { InboxList } from '../features/posts/components/inbox-list';
import { inboxQuery, POST_STATES, STATE_LABELS, type InboxQuery } from '../shared/schemas/posts';
import { requireAccount, rethrowAsRouteError, type LoaderDeps } from './route-guards';

const queryFrom = (sp: URLSearchParams): InboxQuery => {
  const parsed = inboxQuery.safeParse(Object.fromEntries(sp));
  return parsed.success ? parsed.data : { order: 'unanswered' };
};

export function inboxLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    await deps.queryClient.ensureQueryData(inboxOptions(deps.api, queryFrom(new URL(request.url).searchParams))).catch(rethrowAsRouteError);
    return null;
  };
}

const select = 'mt-1 min-h-11 w-full border border-rule bg-card px-2 text-[15px] text-ink';

/** The build team's inbox: every post on their builds, filtered; answer and set states in place. */
export function InboxPage() {
  const [sp] = useSearchParams();
  const q = queryFrom(sp);
  const { data, error, refetch, isFetching } = useInbox(q);
  const { data: session } = useSession();
  return (
    <>
      <title>Inbox — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Build team" title="Inbox">
        Questions and suggestions on your builds. Keys: <kbd>j</kbd>/<kbd>k</kbd> or the arrow keys move between posts, <kbd>r</kbd> opens
        the reply box.
      </PageHeading>
      {data ? (
        <Form method="get" className="mt-6 mb-5 grid grid-cols-2 gap-3 sm:grid-cols-5 sm:items-end" key={sp.toString()}>
          <label className="text-[14px] font-semibold">
            Build
            <select name="buildId" defaultValue={q.buildId ?? ''} className={select}>
              <option value="">All builds</option>
              {data.builds.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.title}
                </option>
              ))}
            </select>
          </label>
          <label className="text-[14px] font-semibold">
            Kind
            <select name="kind" defaultValue={q.kind ?? ''} className={select}>
              <option value="">All</option>
              <option value="question">Questions</option>
              <option value="suggestion">Suggestions</option>
            </select>
          </label>
          <label className="text-[14px] font-semibold">
            State
            <select name="state" defaultValue={q.state ?? ''} className={select}>
              <option value="">All</option>
              {POST_STATES.map((s) => (
                <option key={s} value={s}>
                  {STATE_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
          <label className="text-[14px] font-semibold">
            Order
            <select name="order" defaultValue={q.order} className={select}>
              <option value="unanswered">Unanswered first</option>
              <option value="newest">Newest first</option>
            </select>
          </label>
          <Button type="submit" variant="secondary">
            Filter
          </Button>
        </Form>
      ) : null}
      {!data ? (
        <QueryState
          error={error}
          isFetching={isFetching}
          refetch={refetch}
          errorTitle="The inbox could not be loaded."
          loadingTitle="Loading the inbox…"
        />
      ) : !data.builds.length ? (
        <StateMessage kind="empty" title="You are on no build team yet.">
          <p>Posts on the builds you run or edit arrive here.</p>
        </StateMessage>
      ) : !data.items.length ? (
        <StateMessage kind="empty" title="No posts match.">
          <p>{data.openCount ? `${data.openCount} open posts in all; change the filters to see them.` : 'Nothing waits for an answer.'}</p>
        </StateMessage>
      ) : (
        <>
          <p className="mb-2 text-ink-2">
            {data.openCount} open · {data.items.length} shown
          </p>
          <InboxList items={data.items} isAdmin={session?.account?.isAdmin ?? false} />
        </>
      )}
    </>
  );
}
