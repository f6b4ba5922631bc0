import { useRef, useState, type KeyboardEvent } from 'react';
import { Link } from 'react-router';
import { paths } from '../../../shared/paths';
import { postMoment } from '../../../shared/post-anchors';
import { momentAnchor } from '../../../shared/paths';
import type { InboxItem } from '../../../shared/schemas/posts';
import { PostActions, type PostMode } from './post-actions';
import { PostCard } from './post-card';

const TYPING = new Set(['INPUT', 'TEXTAREA', 'SELECT']);

/**
 * The inbox's posts as a keyboard-driven list: j / ↓ and k / ↑ move between posts, r opens the
 * reply box of the current one; the state select and buttons work in place.
 */
export function InboxList({ items, isAdmin }: { items: readonly InboxItem[]; isAdmin: boolean }) {
  const [current, setCurrent] = useState(0);
  const [modes, setModes] = useState<Record<number, PostMode>>({});
  const refs = useRef<Array<HTMLLIElement | null>>([]);
  const move = (to: number) => {
    const i = Math.max(0, Math.min(items.length - 1, to));
    setCurrent(i);
    refs.current[i]?.focus();
  };
  const onKeyDown = (e: KeyboardEvent<HTMLUListElement>) => {
    if (TYPING.has((e.target as HTMLElement).tagName) || e.altKey || e.ctrlKey || e.metaKey) return;
    if (e.key === 'j' || e.key === 'ArrowDown') move(current + 1);
    else if (e.key === 'k' || e.key === 'ArrowUp') move(current - 1);
    else if (e.key === 'r' && items[current]) setModes({ ...modes, [items[current]!.id]: 'reply' });
    else return;
    e.preventDefault();
  };
  const viewer = { signedIn: true, isTeam: true, isAdmin };
  return (
    <ul aria-label="Posts to handle" onKeyDown={onKeyDown} className="divide-y divide-rule border-y border-rule">
      {items.map((p, i) => (
        <li
          key={p.id}
          ref={(el) => {
            refs.current[i] = el;
          }}
          tabIndex={i === current ? 0 : -1}
          onFocus={(e) => (e.target === e.currentTarget ? setCurrent(i) : undefined)}
          aria-current={i === current ? 'true' : undefined}
          className={`py-4 pr-2 pl-2 outline-offset-2 focus:outline-2 focus:outline-oxide ${i === current ? 'bg-card' : ''}`}
        >
          <PostCard
            post={p}
            momentHref={`${paths.episode(p.build.ownerHandle, p.build.slug, p.episode.slug)}#${momentAnchor(postMoment(p))}`}
            context={
              <p className="label-condensed mb-1">
                {p.build.title} ·{' '}
                <Link
                  to={`${paths.episode(p.build.ownerHandle, p.build.slug, p.episode.slug)}#post-${p.id}`}
                  className="underline underline-offset-2"
                >
                  Ep. {p.episode.number}: {p.episode.title}
                </Link>
                {p.unanswered ? <span className="ml-2 text-oxide-2">Unanswered</span> : null}
              </p>
            }
            actions={
              <PostActions post={p} viewer={viewer} mode={modes[p.id] ?? null} onModeChange={(m) => setModes({ ...modes, [p.id]: m })} />
            }
          />
        </li>
      ))}
    </ul>
  );
}
