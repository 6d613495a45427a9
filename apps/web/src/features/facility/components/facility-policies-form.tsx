import { type FacilityPolicySettings, facilityPolicySettingsSchema } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { Controller, type Path, useForm } from 'react-hook-form';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyApiFieldErrors } from '../../../lib/form-errors';
import { type FacilityDetail, useFacility } from '../api/get-facility';
import { useUpdateFacilityPolicies } from '../api/update-facility-policies';

const weekdayNames = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

/** The form's values: stored policies with the defaults the API applies when a value was never set. */
export function policyValues(f: FacilityDetail): FacilityPolicySettings {
  const p = f.policies!;
  return {
    ...p,
    usageGraceMinutes: p.usageGraceMinutes ?? 30,
    trainingReminderDays: p.trainingReminderDays ?? 30,
    invoiceDaysUntilDue: p.invoiceDaysUntilDue ?? 30,
    pumpPulseSpecFs: p.pumpPulseSpecFs ?? null,
    workingHours: p.workingHours ?? { start: '08:00', end: '18:00', weekdays: [1, 2, 3, 4, 5] },
    usageWindowMinutes: f.usageWindowMinutes ?? 60,
  };
}

/** The zone's UTC offset right now, e.g. "GMT-05:00", so staff read working hours as wall-clock times there. */
function zoneOffsetNow(timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' }).formatToParts(new Date()).find((x) => x.type === 'timeZoneName');
  return part?.value ?? '';
}

const numberFields: { name: Path<FacilityPolicySettings>; label: string; unit: string; hint?: string; step?: string; optional?: boolean }[] = [
  { name: 'minBookingHours', label: 'Shortest booking', unit: 'h', step: '0.5' },
  { name: 'maxBookingHours', label: 'Longest booking', unit: 'h', step: '0.5' },
  { name: 'horizonDays', label: 'Booking horizon', unit: 'days', hint: 'How far ahead beam time can be booked.' },
  { name: 'externalLeadHours', label: 'Lead time for external users', unit: 'h' },
  { name: 'cancellationFreeHours', label: 'Free cancellation until', unit: 'h before start' },
  { name: 'cancellationHalfFeeHours', label: 'Half fee from', unit: 'h before start', hint: 'Later than this, the full fee applies.' },
  { name: 'usageWindowMinutes', label: 'Session-log window', unit: 'min', hint: 'Logged times may lie this far before the booking starts and after it ends.' },
  { name: 'usageGraceMinutes', label: 'Usage grace', unit: 'min', hint: 'Larger differences from the booking are flagged to staff.' },
  { name: 'trainingReminderDays', label: 'Training reminder', unit: 'days before expiry' },
  { name: 'invoiceDaysUntilDue', label: 'Invoice due after', unit: 'days' },
  { name: 'pumpPulseSpecFs', label: 'Pump pulse specification', unit: 'fs', hint: 'Drawn on the pulse trend; leave empty for none.', optional: true },
];

const asNumber = (optional: boolean) => (v: unknown) => (v === '' || v === null || v === undefined ? (optional ? null : undefined) : Number(v));

/** Facility policies: editable by an administrator, read-only for staff. */
export function FacilityPoliciesForm({ canEdit }: { canEdit: boolean }) {
  const facility = useFacility();
  const save = useUpdateFacilityPolicies();
  const form = useForm<FacilityPolicySettings>({ resolver: zodResolver(facilityPolicySettingsSchema) });
  const { register, handleSubmit, reset, control, setError, formState } = form;
  const f = facility.data;
  useEffect(() => { if (f?.policies) reset(policyValues(f)); }, [f, reset]);

  const submit = handleSubmit((values) =>
    save.mutate(values, {
      onSuccess: () => toast.success('Facility policies saved'),
      onError: (e) => { if (!applyApiFieldErrors(e, setError, [...numberFields.map((x) => x.name), 'workingHours.start', 'workingHours.end', 'workingHours.weekdays'])) toast.error(e.message); },
    }),
  );
  const err = (name: string) => name.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], formState.errors) as { message?: string } | undefined;

  return (
    <section className="rounded-xl border border-line bg-panel px-4 py-4" data-testid="facility-policies" aria-labelledby="facility-policies-title">
      <h2 id="facility-policies-title" className="font-semibold">Facility policies</h2>
      <p className="text-sm text-ink-muted">
        Booking, cancellation and session-log rules. New values apply to the next booking check.{' '}
        {canEdit ? 'Each change is recorded in the audit log.' : 'Only an administrator can change them.'}
      </p>
      {facility.isError && <p className="mt-2 text-sm text-danger">{facility.error.message}</p>}
      {f?.policies && (
        <form onSubmit={submit} noValidate className="mt-3" data-testid="facility-policies-form">
          <fieldset disabled={!canEdit || save.isPending} className="grid gap-4 sm:grid-cols-2">
            {numberFields.map((x) => (
              <TextField
                key={x.name}
                label={`${x.label} (${x.unit})`}
                type="number"
                inputMode="decimal"
                step={x.step ?? '1'}
                hint={x.hint}
                error={err(x.name)?.message}
                data-testid={`policy-${x.name}`}
                {...register(x.name, { setValueAs: asNumber(!!x.optional) })}
              />
            ))}
            <div className="sm:col-span-2 rounded-lg border border-line px-3 py-3">
              <p className="text-sm font-semibold">Working hours — preferred for slots offered to displaced bookings</p>
              <p className="text-xs text-ink-muted" data-testid="policy-zone-note">
                Times are wall-clock times in the facility zone, {f.timeZone} (now {zoneOffsetNow(f.timeZone)}). The zone itself is set when the
                facility is installed and is not editable here.
              </p>
              <div className="mt-2 grid gap-4 sm:grid-cols-2">
                <TextField label="Start (facility time)" type="time" error={err('workingHours.start')?.message} data-testid="policy-workingHours.start" {...register('workingHours.start')} />
                <TextField label="End (facility time)" type="time" error={err('workingHours.end')?.message} data-testid="policy-workingHours.end" {...register('workingHours.end')} />
              </div>
              <Controller
                control={control}
                name="workingHours.weekdays"
                render={({ field, fieldState }) => (
                  <div className="mt-3" role="group" aria-label="Staffed weekdays">
                    <div className="flex flex-wrap gap-3 text-sm">
                      {weekdayNames.map((name, day) => (
                        <label key={name} className="flex items-center gap-1.5">
                          <input
                            type="checkbox"
                            data-testid={`policy-weekday-${day}`}
                            checked={(field.value ?? []).includes(day)}
                            onChange={(e) => field.onChange(e.target.checked ? [...(field.value ?? []), day].sort((a, b) => a - b) : (field.value ?? []).filter((d) => d !== day))}
                          />
                          {name}
                        </label>
                      ))}
                    </div>
                    {fieldState.error && <p className="mt-1 text-xs font-semibold text-danger" data-testid="field-error">{fieldState.error.message}</p>}
                  </div>
                )}
              />
            </div>
          </fieldset>
          {canEdit && (
            <div className="mt-4 flex gap-2">
              <Button type="submit" busy={save.isPending} data-testid="save-policies">Save policies</Button>
              <Button type="button" variant="secondary" onClick={() => reset(policyValues(f))}>Undo changes</Button>
            </div>
          )}
        </form>
      )}
    </section>
  );
}
