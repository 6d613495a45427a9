import type { MaintenanceDto } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { fieldsToInstant, formatMinutes, instantToFields } from '../../../lib/wall-time';
import { useCreateMaintenance } from '../api/create-maintenance';
import { useDeleteMaintenance } from '../api/delete-maintenance';
import { useUpdateMaintenance } from '../api/update-maintenance';
import { displacedToast } from './displaced-toast';

const formSchema = z.object({
  instrumentId: z.string().min(1, 'Choose an instrument'),
  startDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose a date'),
  startTime: z.string().regex(/^\d{2}:\d{2}$/, 'Choose a time'),
  endDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose a date'),
  endTime: z.string().regex(/^\d{2}:\d{2}$/, 'Choose a time'),
  reason: z.string().trim().min(3, 'Say what the maintenance is').max(500),
});
type FormValues = z.infer<typeof formSchema>;

export interface MaintenanceFormProps {
  open: boolean;
  onClose: () => void;
  timeZone: string;
  instruments: { id: string; name: string }[];
  initial: { instrumentId?: string; startsAt?: string; endsAt?: string };
  /** editing an existing window; null for a new one */
  existing: MaintenanceDto | null;
}

export function MaintenanceForm(props: MaintenanceFormProps) {
  return (
    <Dialog
      open={props.open}
      onClose={props.onClose}
      title={props.existing ? 'Maintenance window' : 'Block maintenance'}
      description="Bookings inside the window are displaced; their owners are offered three alternatives."
      testId="maintenance-dialog"
    >
      <MaintenanceFormBody {...props} />
    </Dialog>
  );
}

function MaintenanceFormBody({ onClose, timeZone, instruments, initial, existing }: MaintenanceFormProps) {
  // Same time tomorrow, on the hour (as the request form): nobody plans maintenance for 21:02.
  const startsAt = existing?.startsAt ?? initial.startsAt ?? new Date(Math.floor((Date.now() + 86_400_000) / 3_600_000) * 3_600_000).toISOString();
  const endsAt = existing?.endsAt ?? initial.endsAt ?? new Date(new Date(startsAt).getTime() + 4 * 3_600_000).toISOString();
  const start = instantToFields(startsAt, timeZone);
  const end = instantToFields(endsAt, timeZone);
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      instrumentId: existing?.instrumentId ?? initial.instrumentId ?? instruments[0]?.id ?? '',
      startDate: start.date,
      startTime: start.time,
      endDate: end.date,
      endTime: end.time,
      reason: existing?.reason ?? '',
    },
  });
  const create = useCreateMaintenance();
  const update = useUpdateMaintenance();
  const remove = useDeleteMaintenance();
  const values = useWatch({ control: form.control });
  const from = fieldsToInstant({ date: values.startDate ?? '', time: values.startTime ?? '' }, timeZone);
  const to = fieldsToInstant({ date: values.endDate ?? '', time: values.endTime ?? '' }, timeZone);
  const minutes = from && to ? Math.round((to.instant.getTime() - from.instant.getTime()) / 60_000) : null;
  const failure = create.error ?? update.error ?? remove.error;

  const onSubmit = form.handleSubmit((v) => {
    if (!from || !to || minutes === null || minutes <= 0) {
      form.setError('endTime', { type: 'validate', message: 'The end must be after the start' });
      return;
    }
    const body = { startsAt: from.instant.toISOString(), endsAt: to.instant.toISOString(), reason: v.reason };
    if (existing) {
      update.mutate({ id: existing.id, ...body }, { onSuccess: (result) => (displacedToast('updated', result), onClose()) });
    } else {
      create.mutate({ instrumentId: v.instrumentId, ...body }, { onSuccess: (result) => (displacedToast('blocked', result), onClose()) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="maintenance-form">
      <SelectField label="Instrument" disabled={existing !== null} {...form.register('instrumentId')}>
        {instruments.map((i) => (
          <option key={i.id} value={i.id}>
            {i.name}
          </option>
        ))}
      </SelectField>
      <p className="text-xs text-ink-muted">Times are wall-clock in {timeZone} (facility time).</p>
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Start date" type="date" error={form.formState.errors.startDate?.message} {...form.register('startDate')} />
        <TextField label="Start time" type="time" error={form.formState.errors.startTime?.message} {...form.register('startTime')} />
        <TextField label="End date" type="date" error={form.formState.errors.endDate?.message} {...form.register('endDate')} />
        <TextField label="End time" type="time" error={form.formState.errors.endTime?.message} {...form.register('endTime')} />
      </div>
      {[from?.note, to?.note].filter(Boolean).map((note) => (
        <Notice key={note} title="Clock change">
          {note}
        </Notice>
      ))}
      {minutes !== null && minutes > 0 && <p className="text-sm text-ink-muted">Length: {formatMinutes(minutes)}</p>}
      <TextField label="Reason" placeholder="e.g. Pump diode replacement and realignment" error={form.formState.errors.reason?.message} {...form.register('reason')} />
      {failure && <Notice tone="danger" title="Not saved">{failure.message}</Notice>}
      <div className="flex items-center justify-between gap-2 pt-2">
        {existing ? (
          <Button
            variant="danger"
            data-testid="delete-maintenance"
            busy={remove.isPending}
            onClick={() => remove.mutate(existing.id, { onSuccess: () => (toast.success('Maintenance window removed'), onClose()) })}
          >
            Delete window
          </Button>
        ) : (
          <span />
        )}
        <div className="flex gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" data-testid="save-maintenance" busy={create.isPending || update.isPending}>
            {existing ? 'Save changes' : 'Block the time'}
          </Button>
        </div>
      </div>
    </form>
  );
}
