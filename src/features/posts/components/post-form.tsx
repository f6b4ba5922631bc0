import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { formatTime, parseTime } from '../../../shared/chapters';
import type { PostKind } from '../../../shared/schemas/posts';
import { useCreatePost } from '../api/post-mutations';

export interface PostChapter {
  startSeconds: number;
  endSeconds: number | null;
  title: string;
}

/** Ask a question or make a suggestion on a chapter, optionally at a moment (m:ss) inside it. */
export function PostForm({ episodeId, chapters }: { episodeId: number; chapters: readonly PostChapter[] }) {
  const id = useId();
  const create = useCreatePost(episodeId);
  const [kind, setKind] = useState<PostKind>('question');
  const [chapter, setChapter] = useState(chapters[0]?.startSeconds ?? 0);
  const [moment, setMoment] = useState('');
  const [body, setBody] = useState('');
  const [local, setLocal] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const fields = create.error instanceof ApiError ? (create.error.fields ?? {}) : {};
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setLocal(null);
    setDone(false);
    const at = moment.trim() ? parseTime(moment.trim()) : null;
    if (moment.trim() && at === null) return setLocal('Write the moment as m:ss, for example 2:35');
    create.mutate(
      { kind, chapterStartSeconds: chapter, atSeconds: at, body },
      {
        onSuccess: () => {
          setBody('');
          setMoment('');
          setDone(true);
        },
      },
    );
  };
  const momentError = local ?? fields.atSeconds?.[0];
  const ch = chapters.find((c) => c.startSeconds === chapter);
  const field = 'mt-1 w-full border border-rule bg-card px-3 py-2 text-[16px] text-ink';
  return (
    <form onSubmit={submit} aria-labelledby={`${id}-h`} className="mt-6 border border-rule bg-card p-4">
      <h3 id={`${id}-h`} className="label-condensed">
        Ask or suggest
      </h3>
      <fieldset className="mt-2 flex gap-4">
        <legend className="sr-only">Kind of post</legend>
        {(['question', 'suggestion'] as const).map((k) => (
          <label key={k} className="flex min-h-11 items-center gap-2 text-[15px]">
            <input type="radio" name={`${id}-kind`} value={k} checked={kind === k} onChange={() => setKind(k)} />
            {k === 'question' ? 'Question' : 'Suggestion'}
          </label>
        ))}
      </fieldset>
      <div className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-[minmax(0,1fr)_9rem]">
        <div>
          <label htmlFor={`${id}-chapter`} className="block text-[15px] font-semibold">
            Chapter
          </label>
          <select id={`${id}-chapter`} value={chapter} onChange={(e) => setChapter(Number(e.target.value))} className={`${field} min-h-11`}>
            {chapters.map((c) => (
              <option key={c.startSeconds} value={c.startSeconds}>
                {formatTime(c.startSeconds)} {c.title}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-moment`} className="block text-[15px] font-semibold">
            Moment <span className="font-normal text-slate">(optional)</span>
          </label>
          <input
            id={`${id}-moment`}
            value={moment}
            onChange={(e) => setMoment(e.target.value)}
            placeholder={formatTime(chapter)}
            inputMode="numeric"
            aria-invalid={momentError ? true : undefined}
            aria-describedby={`${id}-moment-hint`}
            className={`${field} min-h-11 font-mono`}
          />
        </div>
      </div>
      <p
        id={`${id}-moment-hint`}
        className={`mt-1 text-[14px] ${momentError ? 'text-oxide-2' : 'text-slate'}`}
        role={momentError ? 'alert' : undefined}
      >
        {momentError ??
          `m:ss inside the chapter: ${formatTime(chapter)}${ch?.endSeconds ? ` to ${formatTime(ch.endSeconds)}` : ' onwards'}.`}
      </p>
      <label htmlFor={`${id}-body`} className="mt-3 block text-[15px] font-semibold">
        Your {kind}
      </label>
      <textarea id={`${id}-body`} rows={4} maxLength={4000} value={body} onChange={(e) => setBody(e.target.value)} className={field} />
      <p className="mt-1 text-[14px] text-slate">Plain text; web addresses become links.</p>
      {fields.body ? <p className="text-[14px] text-oxide-2">{fields.body[0]}</p> : null}
      {create.error && !fields.atSeconds && !fields.body ? (
        <p role="alert" className="mt-1 text-[14px] text-oxide-2">
          {create.error instanceof ApiError ? create.error.message : 'Your post could not be sent; try again.'}
        </p>
      ) : null}
      {done ? (
        <p role="status" className="mt-1 text-[14px] text-gauge">
          Posted. The build team will see it in their inbox.
        </p>
      ) : null}
      <Button type="submit" className="mt-3" disabled={create.isPending || !body.trim()}>
        Post {kind}
      </Button>
    </form>
  );
}
