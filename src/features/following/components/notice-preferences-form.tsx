import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import type { NoticePreferences } from '../../../shared/schemas/following';
import { useSaveNoticePreferences } from '../api/mutations';

/** Which notices reach this person by e-mail, and how often. In-app notifications always show. */
export function NoticePreferencesForm({ initial, onTeam }: { initial: NoticePreferences; onTeam: boolean }) {
  const [prefs, setPrefs] = useState(initial);
  const save = useSaveNoticePreferences();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate(prefs);
  };
  const radio = <K extends 'newEpisodes' | 'newPosts'>(key: K, legend: string, options: Array<[NoticePreferences[K], string]>) => (
    <fieldset className="mt-5">
      <legend className="font-semibold">{legend}</legend>
      {options.map(([value, label]) => (
        <label key={value} className="flex min-h-11 items-center gap-2">
          <input type="radio" name={key} checked={prefs[key] === value} onChange={() => setPrefs({ ...prefs, [key]: value })} />
          {label}
        </label>
      ))}
    </fieldset>
  );
  const check = (key: 'replies' | 'stateChanges', label: string) => (
    <label className="flex min-h-11 items-center gap-2">
      <input type="checkbox" checked={prefs[key]} onChange={(e) => setPrefs({ ...prefs, [key]: e.target.checked })} />
      {label}
    </label>
  );
  return (
    <form onSubmit={submit} className="max-w-measure">
      {radio('newEpisodes', 'New episodes of builds and creators I follow', [
        ['each', 'An e-mail for each episode'],
        ['weekly', 'A weekly digest'],
        ['none', 'No e-mail'],
      ])}
      <fieldset className="mt-5">
        <legend className="font-semibold">My posts</legend>
        {check('replies', 'E-mail me replies to my posts')}
        {check('stateChanges', 'E-mail me when the build team answers, adopts or sets aside my post')}
      </fieldset>
      {onTeam
        ? radio('newPosts', 'New posts on builds I work on', [
            ['each', 'An e-mail for each post'],
            ['daily', 'A daily digest'],
            ['none', 'No e-mail'],
          ])
        : null}
      <Button type="submit" className="mt-5" disabled={save.isPending}>
        Save notice settings
      </Button>
      {save.isSuccess ? (
        <p role="status" className="mt-2 text-gauge">
          Saved.
        </p>
      ) : null}
      {save.isError ? (
        <p role="alert" className="mt-2 text-oxide-2">
          Your settings could not be saved; try again.
        </p>
      ) : null}
    </form>
  );
}
