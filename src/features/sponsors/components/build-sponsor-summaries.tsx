import { Link } from 'react-router';
import { StateMessage } from '../../../components/ui/state-message';
import { useBuildSponsors } from '../api/get-sponsor-summary';
import { sponsorPaths } from '../paths';

/** Build settings: a link to each sponsor's summary of this build (the team's view, before publishing). */
export function BuildSponsorSummaries({ buildId }: { buildId: number }) {
  const { data, error } = useBuildSponsors(buildId);
  return (
    <section aria-labelledby="sponsor-summaries-heading" className="max-w-2xl">
      <h2 id="sponsor-summaries-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
        Sponsor summaries
      </h2>
      {data ? (
        data.items.length ? (
          <ul className="divide-y divide-rule border-y border-rule bg-card">
            {data.items.map((s) => (
              <li key={s.id} className="px-4 py-3">
                <Link to={sponsorPaths.teamSummary(buildId, s.id)}>Summary for {s.name}</Link>
              </li>
            ))}
          </ul>
        ) : (
          <StateMessage kind="empty" title="No supported part lines yet.">
            <p>Once a part line carries a sponsor’s support, that sponsor’s summary of this build opens from here.</p>
          </StateMessage>
        )
      ) : error ? (
        <StateMessage kind="error" title="The build’s sponsors could not be loaded.">
          <p>{error.message}</p>
        </StateMessage>
      ) : (
        <StateMessage kind="loading" title="Loading the build’s sponsors…" />
      )}
    </section>
  );
}
