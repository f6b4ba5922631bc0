import { useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { TextField } from '../../../../components/ui/text-field';
import { openItemCreate } from '../../../../shared/schemas/episodes';

interface AddOpenItemFormProps {
  episodeId: number;
  pending: boolean;
  onAdd: (body: { title: string; note: string | null; openedInEpisodeId: number }) => Promise<unknown>;
}

/** Something left for a later session: "Re-bleed after bedding in", "Fit new pads". */
export function AddOpenItemForm({ episodeId, pending, onAdd }: AddOpenItemFormProps) {
  const [title, setTitle] = useState('');
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | undefined>();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = openItemCreate.safeParse({ title, note: note.trim() === '' ? null : note, openedInEpisodeId: episodeId });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    onAdd({ title: parsed.data.title, note: parsed.data.note ?? null, openedInEpisodeId: episodeId })
      .then(() => {
        setTitle('');
        setNote('');
      })
      // The panel shows the mutation's error; the typed text stays for another try.
      .catch(() => undefined);
  };

  return (
    <form noValidate onSubmit={submit} className="mt-4 space-y-3 border border-rule bg-card p-4">
      <TextField label="New open item" value={title} maxLength={160} error={error} onChange={(e) => setTitle(e.target.value)} />
      <TextField label="Note" hint="Optional: what it waits for." value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? 'Adding…' : 'Add open item'}
      </Button>
    </form>
  );
}
