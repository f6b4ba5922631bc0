import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import type { Build } from '../../../shared/schemas/builds';
import { useDeleteBuild } from '../api/build-mutations';

/** "Delete “X” and its 3 episodes?": the question names the build and what goes with it. */
export function deleteBuildQuestion(title: string, episodeCount: number): string {
  if (episodeCount === 0) return `Delete “${title}”?`;
  return `Delete “${title}” and its ${episodeCount === 1 ? 'episode' : `${episodeCount} episodes`}?`;
}

/** The owner deletes the build, behind a confirmation; it can be undone from the Workbench for 30 days. */
export function DeleteBuildSection({ build, onDeleted }: { build: Build; onDeleted: () => void | Promise<void> }) {
  const [open, setOpen] = useState(false);
  const remove = useDeleteBuild(build.id);
  const close = () => {
    setOpen(false);
    remove.reset();
  };

  return (
    <section aria-labelledby="delete-build-heading" className="border border-l-4 border-rule border-l-oxide-2 bg-card px-5 py-5">
      <h2 id="delete-build-heading" className="label-condensed mb-3">
        Delete this build
      </h2>
      <p className="max-w-measure text-ink-2">
        The build and its episodes leave the site and your Workbench at once. You can undo it from the Workbench for 30 days; after that it
        is removed for good.
      </p>
      <Button variant="danger" className="mt-4" onClick={() => setOpen(true)}>
        Delete this build
      </Button>
      <ConfirmDialog
        open={open}
        title={deleteBuildQuestion(build.title, build.episodeCount)}
        confirmLabel="Delete build"
        cancelLabel="Keep the build"
        pending={remove.isPending}
        error={remove.isError ? `The build could not be deleted: ${remove.error.message}` : undefined}
        onConfirm={() => remove.mutate(undefined, { onSuccess: () => void onDeleted() })}
        onClose={close}
      >
        <p>
          {build.episodeCount === 0
            ? `${build.title} has no episodes yet.`
            : `${build.episodeCount === 1 ? 'Its one episode goes' : `All ${build.episodeCount} of its episodes go`} with it — drafts, scheduled and published — together with their chapters and open items.`}{' '}
          Readers can no longer open it.
        </p>
        <p>Undo it from your Workbench within 30 days to bring it all back.</p>
      </ConfirmDialog>
    </section>
  );
}
