import { isRouteErrorResponse, useRouteError } from 'react-router';
import { Button, ButtonLink } from '../components/ui/button';
import { StateMessage } from '../components/ui/state-message';
import { Forbidden } from '../routes/forbidden';
import { NotFound } from '../routes/not-found';
import { SignInRequired } from '../routes/sign-in-required';
import { paths } from '../shared/paths';
import { SiteFooter, SiteHeader, SkipLink } from './shell';

/**
 * Root ErrorBoundary. It replaces the Shell, so it brings its own header and footer; details of the
 * error stay out of the page (no messages, no stacks) because they can leak internals. Loaders throw
 * `data(null, { status })` for 401, 403 and 404, and each gets a page that says what to do next.
 */
export function RouteErrorBoundary() {
  const error = useRouteError();
  const status = isRouteErrorResponse(error) ? error.status : null;
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <SiteHeader />
      <main id="main" tabIndex={-1} className="page-wrap w-full flex-1 pt-8 pb-4 focus:outline-none">
        {status === 401 ? <SignInRequired /> : status === 403 ? <Forbidden /> : status === 404 ? <NotFound /> : <SomethingWentWrong />}
      </main>
      <SiteFooter />
    </div>
  );
}

function SomethingWentWrong() {
  return (
    <>
      <title>Something went wrong — Rivet &amp; Reel</title>
      <h1 className="mb-6 font-serif text-[27px] leading-tight font-bold md:text-[38px]">Something went wrong</h1>
      <StateMessage
        kind="error"
        title="This page could not be shown."
        action={
          <>
            {/* A full reload, not a re-render: the failure may be in code or data this render already holds. */}
            <Button onClick={() => window.location.reload()}>Try again</Button>
            <ButtonLink to={paths.home()}>Go to the front page</ButtonLink>
          </>
        }
      >
        <p>It may be a passing fault. Try again in a moment, or start from the front page.</p>
      </StateMessage>
    </>
  );
}
