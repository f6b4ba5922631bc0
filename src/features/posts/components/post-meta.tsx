import { Plate } from '../../../components/ui/plate';
import { formatTime } from '../../../shared/chapters';
import { STATE_LABELS } from '../../../shared/constants/posts';
import type { Post } from '../../../shared/schemas/posts';

/** The state tag: adopted in gauge green, answered in ink, set aside in slate, open quiet. */
export function StateTag({ state }: { state: Post['state'] }) {
  const tone = state === 'adopted' ? 'gauge' : state === 'answered' ? 'ink' : 'slate';
  return <Plate tone={tone}>{STATE_LABELS[state]}</Plate>;
}

/** The moment in mono oxide: a link to the video (or the page's anchor) when there is one. */
export function MomentLink({ seconds, href }: { seconds: number; href: string | null }) {
  const time = formatTime(seconds);
  if (!href) return <span className="font-mono text-[13px] text-oxide-2">{time}</span>;
  return (
    <a href={href} rel="noopener noreferrer" className="font-mono text-[13px] text-oxide-2" aria-label={`At ${time} in the video`}>
      {time}
    </a>
  );
}
