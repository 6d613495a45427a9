import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { TextField } from '../../../components/ui/field';

/** Asks for the reason a record or sign-off is withdrawn; the reason is kept with it and in the audit trail. */
export function RevokeDialog({ what, open, busy, error, onClose, onConfirm }: {
  what: string; open: boolean; busy: boolean; error?: string; onClose: () => void; onConfirm: (reason: string) => void;
}) {
  const [reason, setReason] = useState('');
  return (
    <Dialog open={open} onClose={onClose} title={`Revoke ${what}`} description="The record stays in the history, marked revoked with your name and reason." testId="revoke-dialog">
      <form
        className="space-y-4"
        onSubmit={(event) => {
          event.preventDefault();
          onConfirm(reason);
        }}
      >
        <TextField label="Reason" name="reason" required minLength={3} maxLength={500} value={reason} error={error} onChange={(e) => setReason(e.target.value)} />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>Keep it</Button>
          <Button type="submit" variant="danger" busy={busy} data-testid="confirm-revoke">Revoke</Button>
        </div>
      </form>
    </Dialog>
  );
}
