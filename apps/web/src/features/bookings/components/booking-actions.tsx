import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { formatInstant } from '../../../lib/wall-time';
import { useCancelBooking } from '../api/cancel-booking';
import { useDeclineBooking } from '../api/decline-booking';
import type { CancellationFee } from '../lib/cancellation-fee';

/** Decline asks for a reason the requester will read. */
export function DeclineAction({ bookingId, onDone }: { bookingId: string; onDone?: () => void }) {
  const decline = useDeclineBooking();
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState('');
  if (!asking) {
    return (
      <Button variant="danger" data-testid="decline-booking" onClick={() => setAsking(true)}>
        Decline…
      </Button>
    );
  }
  const tooShort = reason.trim().length < 3;
  return (
    <div className="w-full space-y-2 rounded-lg border border-line p-3">
      <TextField
        label="Reason for the requester"
        data-testid="decline-reason"
        name="reason"
        autoFocus
        value={reason}
        onChange={(e) => setReason(e.target.value)}
        hint="At least a few words; it goes to the requester."
      />
      <div className="flex justify-end gap-2">
        <Button variant="secondary" size="sm" onClick={() => setAsking(false)}>
          Back
        </Button>
        <Button
          variant="danger"
          size="sm"
          data-testid="confirm-decline"
          disabled={tooShort}
          busy={decline.isPending}
          onClick={() =>
            decline.mutate(
              { id: bookingId, reason: reason.trim() },
              { onSuccess: () => (toast.success('Request declined'), onDone?.()), onError: (e) => toast.error(e.message) },
            )
          }
        >
          Decline request
        </Button>
      </div>
    </div>
  );
}

/** Cancel shows the fee that applies now, from the facility's windows, before it is confirmed. */
export function CancelAction({ bookingId, fee, timeZone, onDone }: { bookingId: string; fee: CancellationFee; timeZone: string; onDone?: () => void }) {
  const cancel = useCancelBooking();
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button variant="danger" size="sm" data-testid="cancel-booking" onClick={() => setAsking(true)}>
        Cancel booking…
      </Button>
    );
  }
  return (
    <div className="space-y-2 rounded-lg border border-danger/40 bg-danger-soft p-3" data-testid="cancel-confirm" data-fee-percent={fee.percent}>
      <p className="font-semibold">Cancellation fee now: {fee.percent} %</p>
      <p className="text-ink-muted">
        {fee.summary}
        {fee.changesAt && fee.changesAt.getTime() > Date.now() && ` This changes at ${formatInstant(fee.changesAt, timeZone)}.`}
      </p>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" size="sm" onClick={() => setAsking(false)}>
          Keep the booking
        </Button>
        <Button
          variant="danger"
          size="sm"
          data-testid="confirm-cancel"
          busy={cancel.isPending}
          onClick={() =>
            cancel.mutate(
              { id: bookingId },
              {
                onSuccess: ({ booking }) => {
                  toast.success(`Booking cancelled · fee ${booking.detail?.cancellationFeePercent ?? fee.percent} %`);
                  onDone?.();
                },
                onError: (e) => toast.error(e.message),
              },
            )
          }
        >
          {fee.percent === 0 ? 'Cancel — no fee' : `Cancel with ${fee.percent} % fee`}
        </Button>
      </div>
    </div>
  );
}
