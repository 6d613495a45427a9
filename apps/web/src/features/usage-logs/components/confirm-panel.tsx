import type { UsageLogDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { fieldsToInstant, formatInstant, formatMinutes, instantToFields, minutesBetween } from '../../../lib/wall-time';
import { useConfirmUsage } from '../api/confirm-usage';
import { lockedDetails } from '../lib/log-status';

export interface ConfirmPanelProps {
  log: UsageLogDto;
  booking: { startsAt: string; endsAt: string };
  timeZone: string;
}

/** Staff confirm a submitted log, as logged or with corrected times; the API audits the adjustment. */
export function ConfirmPanel({ log, booking, timeZone }: ConfirmPanelProps) {
  const confirm = useConfirmUsage();
  const initialStart = instantToFields(log.actualStartsAt, timeZone);
  const initialEnd = instantToFields(log.actualEndsAt, timeZone);
  const [start, setStart] = useState(initialStart);
  const [end, setEnd] = useState(initialEnd);
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  const startAt = fieldsToInstant(start, timeZone)?.instant.toISOString() ?? null;
  const endAt = fieldsToInstant(end, timeZone)?.instant.toISOString() ?? null;
  const changedStart = startAt !== null && Date.parse(startAt) !== Date.parse(log.actualStartsAt);
  const changedEnd = endAt !== null && Date.parse(endAt) !== Date.parse(log.actualEndsAt);
  const invalid = !startAt || !endAt || Date.parse(endAt) <= Date.parse(startAt);

  const onConfirm = () => {
    if (invalid) return setProblem('The session must end after it starts.');
    setProblem(null);
    confirm.mutate(
      {
        logId: log.id,
        ...(changedStart ? { actualStartsAt: startAt } : {}),
        ...(changedEnd ? { actualEndsAt: endAt } : {}),
        ...(note.trim() ? { note: note.trim() } : {}),
      },
      {
        onSuccess: ({ log: confirmed }) =>
          toast.success('Session log confirmed', {
            description: `${formatInstant(confirmed.actualStartsAt, timeZone)} · ${formatMinutes(minutesBetween(confirmed.actualStartsAt, confirmed.actualEndsAt))}`,
          }),
        onError: (error) => {
          if (isApiError(error) && error.code === 'log_locked') {
            const d = lockedDetails(error.details);
            return setProblem(`Already billed${d.billedBy ? ` by ${d.billedBy}` : ''}${d.billedAt ? ` on ${formatInstant(d.billedAt, timeZone)}` : ''}; it can no longer be confirmed or changed.`);
          }
          setProblem(error.message);
        },
      },
    );
  };

  return (
    <section className="space-y-3 rounded-xl border border-accent/40 bg-accent-soft/40 px-4 py-4" data-testid="confirm-panel" aria-label="Confirm the log">
      <div>
        <h3 className="text-sm font-bold">Confirm for billing</h3>
        <p className="text-xs text-ink-muted">
          Booked {formatInstant(booking.startsAt, timeZone)} – {formatInstant(booking.endsAt, timeZone)}. Adjust the actual times if the log is wrong;
          the change and your note are kept in the audit trail.
        </p>
      </div>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <TextField label="Actual start date" type="date" name="confirmStartDate" value={start.date} onChange={(e) => setStart({ ...start, date: e.target.value })} />
        <TextField label="Start time" type="time" name="confirmStartTime" value={start.time} onChange={(e) => setStart({ ...start, time: e.target.value })} />
        <TextField label="Actual end date" type="date" name="confirmEndDate" value={end.date} onChange={(e) => setEnd({ ...end, date: e.target.value })} />
        <TextField label="End time" type="time" name="confirmEndTime" value={end.time} onChange={(e) => setEnd({ ...end, time: e.target.value })} />
      </div>
      <TextField
        label="Note (optional)"
        name="confirmNote"
        value={note}
        onChange={(e) => setNote(e.target.value)}
        placeholder={changedStart || changedEnd ? 'Why the times were adjusted' : 'e.g. checked against the interlock log'}
      />
      {problem && (
        <Notice tone="danger" testId="confirm-error">
          {problem}
        </Notice>
      )}
      <div className="flex items-center gap-3">
        <Button data-testid="confirm-usage" busy={confirm.isPending} onClick={onConfirm}>
          {changedStart || changedEnd ? 'Confirm with adjusted times' : 'Confirm as logged'}
        </Button>
        {(changedStart || changedEnd) && !invalid && (
          <span className="text-xs text-ink-muted">
            {formatMinutes(minutesBetween(startAt!, endAt!))} instead of {formatMinutes(minutesBetween(log.actualStartsAt, log.actualEndsAt))}
          </span>
        )}
      </div>
    </section>
  );
}
