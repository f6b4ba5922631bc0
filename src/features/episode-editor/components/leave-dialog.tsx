import type { Blocker } from 'react-router';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';

/** The question a blocked navigation turns into. */
export function LeaveDialog({ blocker, open }: { blocker: Blocker; open: boolean }) {
  return (
    <ConfirmDialog
      open={open && blocker.state === 'blocked'}
      title="Leave with changes not yet saved?"
      confirmLabel="Leave anyway"
      cancelLabel="Stay here"
      tone="primary"
      onConfirm={() => blocker.proceed?.()}
      onClose={() => blocker.reset?.()}
    >
      <p>
        Your latest changes could not be saved to the server just now. They are kept on this device, and the editor offers them again when
        you come back to this episode.
      </p>
    </ConfirmDialog>
  );
}
