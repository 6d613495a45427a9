import type { AffectedBookingDto } from '@femtoslot/shared';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { formatInstant } from '../../../lib/wall-time';
import { usePreviewInstrumentChange, useSaveInstrumentChange, type InstrumentChange } from '../api/save-instrument-change';

const nm = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

function AffectedList({ affected, timeZone }: { affected: AffectedBookingDto[]; timeZone: string }) {
  if (affected.length === 0) {
    return <Notice tone="success" testId="affected-none" title="No future booking is affected by this change." />;
  }
  return (
    <div className="space-y-2" data-testid="affected-bookings">
      <Notice tone="danger" title={`${affected.length} future booking${affected.length === 1 ? '' : 's'} would break a rule after this change`}>
        Saving does not move or cancel them: contact their owners or adjust the change.
      </Notice>
      <ul className="divide-y divide-line rounded-lg border border-line text-sm">
        {affected.map((a) => (
          <li key={a.bookingId} className="space-y-0.5 px-3 py-2" data-testid="affected-booking" data-booking-id={a.bookingId} data-new={a.newlyAffected}>
            <p className="font-semibold">
              {formatInstant(a.startsAt, timeZone, true)} · {a.configurationName} at{' '}
              {a.targetMinNm === a.targetMaxNm ? `${nm.format(a.targetMinNm)} nm` : `${nm.format(a.targetMinNm)}–${nm.format(a.targetMaxNm)} nm`}
              <span className="ml-2 text-xs font-normal text-ink-muted">{a.newlyAffected ? 'new' : 'already affected before'}</span>
            </p>
            <ul className="list-disc pl-5 text-ink-muted">
              {a.problems.map((p) => (
                <li key={p.message} data-code={p.code}>
                  {p.message}
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * Save through a preview: the change is first checked against every future booking (same rules as a request), and
 * Save is offered for exactly the values that were checked. Creations affect no booking and save directly.
 */
export function ReviewAndSave({ change, timeZone, onSaved, label = 'Save' }: { change: InstrumentChange | null; timeZone: string; onSaved?: () => void; label?: string }) {
  const preview = usePreviewInstrumentChange();
  const save = useSaveInstrumentChange();
  const [checked, setChecked] = useState<string | null>(null);
  const key = change ? JSON.stringify(change) : null;
  const creation = change?.kind === 'create-instrument' || change?.kind === 'create-configuration';
  const upToDate = key !== null && checked === key;
  const doSave = () =>
    change &&
    save.mutate(change, {
      onSuccess: () => (toast.success('Saved'), setChecked(null), preview.reset(), onSaved?.()),
      onError: (e) => toast.error(e.message),
    });
  return (
    <div className="space-y-2">
      {!creation && upToDate && preview.data && <AffectedList affected={preview.data} timeZone={timeZone} />}
      {save.error && <Notice tone="danger" testId="save-error" title={save.error.message} />}
      {preview.error && <Notice tone="danger" title={preview.error.message} />}
      <div className="flex flex-wrap justify-end gap-2">
        {!creation && (
          <Button
            variant="secondary"
            size="sm"
            data-testid="preview-change"
            disabled={!change}
            busy={preview.isPending}
            onClick={() => change && preview.mutate(change, { onSuccess: () => setChecked(key) })}
          >
            Check affected bookings
          </Button>
        )}
        <Button size="sm" data-testid="save-change" disabled={!change || (!creation && !upToDate)} busy={save.isPending} onClick={doSave}>
          {label}
        </Button>
      </div>
    </div>
  );
}
