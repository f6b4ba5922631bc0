import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { VISIBILITIES } from '../../../shared/schemas/builds';

type Visibility = (typeof VISIBILITIES)[number];

/** What each visibility means for readers (DESIGN.md, "Visibility"). */
export const VISIBILITY_TEXT: Record<Visibility, { label: string; explanation: string }> = {
  public: { label: 'Public', explanation: 'Listed everywhere: the front page, the builds directory, the site feed and search.' },
  unlisted: {
    label: 'Unlisted',
    explanation: 'Anyone with the link can read it, but it is left off the front page, the site feed and search.',
  },
  private: { label: 'Private', explanation: 'Only the build team can see it; it appears nowhere else.' },
};

/** The three visibilities as radio buttons, each with its one-line explanation. */
export function VisibilityField({ registration, error }: { registration: UseFormRegisterReturn<'visibility'>; error?: string }) {
  const id = useId();
  return (
    <fieldset aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="font-semibold text-ink">Who can read it</legend>
      <p className="mt-0.5 text-[15px] text-slate">Drafts are only ever seen by the build team, whatever you choose here.</p>
      <div className="mt-2 space-y-2">
        {VISIBILITIES.map((v) => (
          <div key={v} className="flex items-start gap-3 border border-rule bg-card px-3 py-2.5">
            <input
              id={`${id}-${v}`}
              type="radio"
              value={v}
              aria-describedby={`${id}-${v}-text`}
              className="mt-1 h-5 w-5 shrink-0 accent-ink"
              {...registration}
            />
            <span className="min-w-0">
              <label htmlFor={`${id}-${v}`} className="block font-semibold">
                {VISIBILITY_TEXT[v].label}
              </label>
              <span id={`${id}-${v}-text`} className="block text-[15px] text-ink-2">
                {VISIBILITY_TEXT[v].explanation}
              </span>
            </span>
          </div>
        ))}
      </div>
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-[15px] font-semibold text-oxide-2">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
