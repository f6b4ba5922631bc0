import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import type { SponsorRef } from '../../../shared/schemas/sponsors';
import { useRemoveLogo, useUploadLogo } from '../api/admin-sponsors';

/** Upload or remove the organisation's logo; it is shown beside its credits and disclosures. */
export function SponsorLogo({ sponsor }: { sponsor: SponsorRef }) {
  const upload = useUploadLogo(sponsor.id);
  const remove = useRemoveLogo(sponsor.id);
  const [file, setFile] = useState<File | null>(null);
  const [alt, setAlt] = useState(`${sponsor.name} logo`);
  const [progress, setProgress] = useState<number | null>(null);
  const [confirming, setConfirming] = useState(false);
  const fileId = useId();

  const send = () => {
    if (!file) return;
    setProgress(0);
    upload.mutate(
      { file, altText: alt, onProgress: setProgress },
      {
        onSettled: () => setProgress(null),
        onSuccess: () => setFile(null),
      },
    );
  };

  return (
    <div className="space-y-4">
      <div className="flex min-h-24 items-center gap-4 border border-rule bg-card p-4">
        {sponsor.logoUrl ? (
          <img src={sponsor.logoUrl} alt={alt} className="max-h-20 max-w-48 object-contain" />
        ) : (
          <p className="text-slate">No logo yet; the organisation is credited by name alone.</p>
        )}
      </div>
      <div className="max-w-lg space-y-3">
        <div>
          <label htmlFor={fileId} className="block font-semibold text-ink">
            Logo file
          </label>
          <p className="mt-0.5 text-[15px] text-slate">A JPEG, PNG, WebP, AVIF or GIF image, at most 25 MB. SVG is not accepted.</p>
          <input
            id={fileId}
            type="file"
            accept="image/jpeg,image/png,image/webp,image/avif,image/gif"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="mt-1.5 block w-full text-[15px]"
          />
        </div>
        <TextField label="Description for screen readers" value={alt} onChange={(e) => setAlt(e.target.value)} maxLength={300} />
        <div className="flex flex-wrap gap-3">
          <Button onClick={send} disabled={!file || upload.isPending}>
            {upload.isPending ? `Uploading… ${Math.round((progress ?? 0) * 100)} %` : 'Upload logo'}
          </Button>
          {sponsor.logoUrl ? (
            <Button variant="secondary" onClick={() => setConfirming(true)}>
              Remove logo
            </Button>
          ) : null}
        </div>
        {upload.isError ? <Notice kind="error">The logo was not stored: {upload.error.message}</Notice> : null}
        {upload.isSuccess ? <Notice kind="success">Logo stored.</Notice> : null}
      </div>
      <ConfirmDialog
        open={confirming}
        title={`Remove the logo of ${sponsor.name}?`}
        confirmLabel="Remove logo"
        cancelLabel="Keep it"
        pending={remove.isPending}
        error={remove.isError ? `The logo could not be removed: ${remove.error.message}` : undefined}
        onConfirm={() => remove.mutate(undefined, { onSuccess: () => setConfirming(false) })}
        onClose={() => {
          setConfirming(false);
          remove.reset();
        }}
      >
        <p>The file is deleted. Build pages and disclosures then credit {sponsor.name} by name only, until a new logo is uploaded.</p>
      </ConfirmDialog>
    </div>
  );
}
