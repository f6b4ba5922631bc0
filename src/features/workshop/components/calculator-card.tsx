import { useId, type ReactNode } from 'react';
import { CALCULATOR_CAUTION } from '../../../shared/figure-checks';

interface CalculatorCardProps {
  title: string;
  intro: ReactNode;
  /** The inputs. */
  form: ReactNode;
  /** The answer; announced politely as it changes. */
  children: ReactNode;
  /** Where the numbers come from, named plainly. */
  sources: string;
}

/** One calculator: inputs, a live answer, its sources and the plain caution every result carries. */
export function CalculatorCard({ title, intro, form, children, sources }: CalculatorCardProps) {
  const id = useId();
  return (
    <section aria-labelledby={`${id}-title`} className="min-w-0 border border-rule bg-card p-4 md:p-5">
      <h2 id={`${id}-title`} className="font-serif text-[22px] leading-tight font-bold text-ink">
        {title}
      </h2>
      <div className="mt-1 text-[15px] text-ink-2">{intro}</div>
      <div className="mt-4">{form}</div>
      <div aria-live="polite" aria-label={`${title}: result`} role="region" className="mt-4 border-t-2 border-ink pt-3">
        {children}
      </div>
      <p className="mt-3 text-sm text-slate">Sources: {sources}</p>
      <p className="mt-2 text-sm text-ink-2">
        <span className="font-condensed font-semibold tracking-label text-caution uppercase">Caution</span> {CALCULATOR_CAUTION}
      </p>
    </section>
  );
}
