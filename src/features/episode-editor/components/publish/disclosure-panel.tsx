import { useId } from 'react';
import type { DisclosureJson } from '../../../../shared/schemas/sponsors';

interface DisclosurePanelProps {
  /** The disclosure worked out from the saved part lines and the build's paid sponsorships; null when none is needed. */
  disclosure: DisclosureJson | null | undefined;
  confirmed: boolean;
  onChange: (confirmed: boolean) => void;
}

/**
 * What readers will see first, and the creator's confirmation that the video says it too — a
 * supported episode cannot be published or scheduled without it (the publish check).
 */
export function DisclosurePanel({ disclosure, confirmed, onChange }: DisclosurePanelProps) {
  const id = useId();
  return (
    <section aria-labelledby={`${id}-heading`}>
      <h2 id={`${id}-heading`} className="label-condensed border-b-2 border-ink pb-2">
        Disclosure
      </h2>
      {disclosure === undefined ? <p className="mt-3 text-slate">Working out the disclosure…</p> : null}
      {disclosure === null ? (
        <p className="mt-3 text-ink-2">No disclosure needed: no supported parts, affiliate links or paid sponsorship on the day.</p>
      ) : null}
      {disclosure ? (
        <>
          <p className="mt-3 border border-brass bg-brass-soft px-3 py-2 text-[15px] text-ink">
            <span className="mr-2 inline-block bg-ink px-1.5 py-0.5 font-condensed text-[12px] font-semibold tracking-[0.12em] text-paper uppercase">
              {disclosure.label}
            </span>
            {disclosure.text}
          </p>
          <p className="mt-2 text-[14px] text-slate">
            Readers see this first on the episode, and in the feed, the share card, the notice e-mails and the chapter block for the video
            description.
          </p>
        </>
      ) : null}
      <div className="mt-3 flex items-start gap-2">
        <input
          id={`${id}-confirm`}
          type="checkbox"
          checked={confirmed}
          onChange={(e) => onChange(e.target.checked)}
          className="mt-1 h-5 w-5 accent-ink"
          aria-describedby={`${id}-confirm-hint`}
        />
        <div>
          <label htmlFor={`${id}-confirm`} className="font-semibold text-ink">
            The video discloses this too
          </label>
          <p id={`${id}-confirm-hint`} className="text-[14px] text-slate">
            Said or shown in the video itself, near the start (UK CAP/ASA guidance; US FTC Endorsement Guides).
          </p>
        </div>
      </div>
    </section>
  );
}
