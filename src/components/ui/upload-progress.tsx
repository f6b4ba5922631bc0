import { useId } from 'react';
import { Button } from './button';

/** A file on its way up: its name, a real progress bar with the percentage, and Cancel. */
export function UploadProgress({ name, progress, onCancel }: { name: string; progress: number; onCancel: () => void }) {
  const id = useId();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <label htmlFor={id} className="min-w-0 truncate">
        Uploading {name}
      </label>
      <progress id={id} max={1} value={progress} className="h-2.5 w-40 accent-oxide" />
      <span className="font-mono text-[13px] text-slate">{Math.round(progress * 100)} %</span>
      <Button variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
