import type { AttachmentDto, BookingDto, UsageLogDto } from '@femtoslot/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { type Path, useFieldArray, useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import type { UsageWindow } from '../api/get-usage';
import { useSaveUsage } from '../api/save-usage';
import { type LockedDetails, leavesBooking, lockedDetails, logStatusOf } from '../lib/log-status';
import { type UsageFormValues, blankSegment, buildUsageBody, formFieldForPath, initialUsageValues, segmentIndexOf, usageFormSchema } from '../lib/usage-form-values';
import { AttachmentsField } from './attachments-field';
import { ConfirmPanel } from './confirm-panel';
import { type UsageConfiguration, SegmentFields } from './segment-fields';
import { OutsideGraceBadge, UsageStatusBadge } from './usage-status';

export interface UsageFormProps {
  booking: BookingDto;
  log: UsageLogDto | null;
  graceMinutes: number;
  /** where actual times may lie; the API refuses others */
  usageWindow?: UsageWindow;
  /** the booking's instrument's configurations */
  configurations: UsageConfiguration[];
  timeZone: string;
  /** staff may confirm a submitted log here */
  canConfirm: boolean;
}

const stamp = (log: UsageLogDto) => Math.max(...[log.submittedAt, log.confirmedAt, log.billedAt].map((t) => (t ? Date.parse(t) : 0)));
const newerLog = (a: UsageLogDto | undefined, b: UsageLogDto | null) => (a && (!b || stamp(a) > stamp(b)) ? a : b);

function lockText(d: LockedDetails, timeZone: string) {
  return `Billed${d.billedBy ? ` by ${d.billedBy}` : ''}${d.billedAt ? ` on ${formatInstant(d.billedAt, timeZone)}` : ''}. A billed log can no longer be changed; ask finance if it is wrong.`;
}

/** The session log of one booking: actual times, segments, notes and attachments. */
export function UsageForm({ booking, log: loaded, graceMinutes, usageWindow, configurations, timeZone, canConfirm }: UsageFormProps) {
  const save = useSaveUsage();
  const log = newerLog(save.data?.log, loaded);
  const form = useForm<UsageFormValues>({ resolver: zodResolver(usageFormSchema), defaultValues: initialUsageValues(booking, loaded, timeZone) });
  const segments = useFieldArray({ control: form.control, name: 'segments' });
  const values = useWatch({ control: form.control }) as UsageFormValues;
  const traceIds = useMemo(() => new Set(loaded?.segments.map((s) => s.traceAttachmentId).filter(Boolean)), [loaded]);
  const [attachments, setAttachments] = useState<AttachmentDto[]>(() => (loaded?.attachments ?? []).filter((a) => !traceIds.has(a.id)));
  const [failure, setFailure] = useState<{ code: string; message: string } | null>(null);
  const [lockedByError, setLockedByError] = useState<LockedDetails | null>(null);

  const billed = log?.status === 'billed' ? { billedBy: log.billedBy, billedAt: log.billedAt } : null;
  const readOnly = billed !== null || lockedByError !== null;
  const status = logStatusOf(log);
  const built = useMemo(() => buildUsageBody(values, timeZone, attachments.map((a) => a.id)), [values, timeZone, attachments]);
  const lengthMinutes = built ? minutesBetween(built.body.actualStartsAt, built.body.actualEndsAt) : null;
  const leaves = built !== null && leavesBooking(booking, built.body.actualStartsAt, built.body.actualEndsAt, graceMinutes);
  const refused = built !== null && usageWindow !== undefined && leavesBooking(booking, built.body.actualStartsAt, built.body.actualEndsAt, usageWindow.windowMinutes);

  const onError = (error: Error) => {
    if (!isApiError(error)) return setFailure({ code: 'error', message: error.message });
    if (error.code === 'log_locked') {
      setLockedByError(lockedDetails(error.details));
      return setFailure({ code: error.code, message: lockText(lockedDetails(error.details), timeZone) });
    }
    if (error.code === 'validation_failed' && Array.isArray(error.details)) {
      for (const issue of error.details as { path?: unknown[]; message?: string }[]) {
        const field = formFieldForPath(issue.path ?? []);
        if (field && issue.message) form.setError(field as Path<UsageFormValues>, { type: 'server', message: issue.message });
      }
    }
    const index = segmentIndexOf(error.details);
    if (index !== null && index < values.segments.length) {
      const pulseCodes = ['below_optical_cycle', 'below_transform_limit', 'too_few_points', 'no_peak', 'peak_at_edge'];
      const field = error.code === 'out_of_range' ? 'minValue' : pulseCodes.includes(error.code) ? 'pulseFwhmFs' : values.segments[index]!.wholeSession ? null : 'startTime';
      if (field) form.setError(`segments.${index}.${field}`, { type: 'server', message: error.message });
    }
    setFailure({ code: error.code, message: error.message });
  };

  const onSubmit = form.handleSubmit((formValues) => {
    const request = buildUsageBody(formValues, timeZone, attachments.map((a) => a.id));
    if (!request) return setFailure({ code: 'incomplete', message: 'Some fields are incomplete; check the tuning ranges and times.' });
    if (Date.parse(request.body.actualEndsAt) <= Date.parse(request.body.actualStartsAt)) {
      return form.setError('actualEndTime', { type: 'validate', message: 'The session must end after it starts' });
    }
    setFailure(null);
    save.mutate(
      { bookingId: booking.id, body: request.body },
      {
        onSuccess: ({ log: saved }) =>
          toast.success('Session log saved', {
            description: saved.outsideGrace
              ? `The times leave the booking by more than ${graceMinutes} min; staff will review them.`
              : 'Staff will confirm it before it is billed.',
          }),
        onError,
      },
    );
  });

  const errors = form.formState.errors;
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center gap-2.5 text-sm">
        <UsageStatusBadge status={status} withTestId />
        <OutsideGraceBadge log={log} />
        {log && <span className="text-ink-muted">Submitted by {log.submittedBy} on {formatInstant(log.submittedAt, timeZone)}</span>}
        {log?.confirmedBy && log.confirmedAt && <span className="text-ink-muted">· confirmed by {log.confirmedBy} on {formatInstant(log.confirmedAt, timeZone)}</span>}
      </div>
      {billed && (
        <Notice tone="info" testId="log-billed" title="This log is billed and read-only">
          {lockText(billed, timeZone)}
        </Notice>
      )}
      {log?.outsideGrace && (
        <Notice tone="info" title="Flagged for review">
          <span data-testid="outside-grace">
            The logged times leave the booking by more than the facility's grace of {graceMinutes} min. Staff will review them before the session is billed.
          </span>
        </Notice>
      )}

      <form onSubmit={onSubmit} noValidate data-testid="usage-form" data-read-only={readOnly || undefined} className="space-y-6">
        <fieldset disabled={readOnly} className="space-y-6">
          <section className="space-y-3">
            <h3 className="text-xs font-bold tracking-wider text-accent uppercase">1 · When the beam was actually used</h3>
            <p className="text-sm text-ink-muted">
              Booked {formatInstant(booking.startsAt, timeZone)} – {formatInstant(booking.endsAt, timeZone)}. Wall-clock time in {timeZone} (facility time).
              {usageWindow && (
                <span data-testid="usage-window">
                  {' '}Actual times may run from {formatInstant(usageWindow.earliestStartsAt, timeZone)} to {formatInstant(usageWindow.latestEndsAt, timeZone)} ({usageWindow.windowMinutes} min either side of the booking).
                </span>
              )}
            </p>
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              <TextField label="Actual start date" type="date" error={errors.actualStartDate?.message} {...form.register('actualStartDate')} />
              <TextField label="Start time" type="time" error={errors.actualStartTime?.message} {...form.register('actualStartTime')} />
              <TextField label="Actual end date" type="date" error={errors.actualEndDate?.message} {...form.register('actualEndDate')} />
              <TextField label="End time" type="time" error={errors.actualEndTime?.message} {...form.register('actualEndTime')} />
            </div>
            {built?.notes.map((note) => (
              <Notice key={note} title="Clock change">
                {note}
              </Notice>
            ))}
            {lengthMinutes !== null && (
              <p className={lengthMinutes <= 0 ? 'text-sm font-semibold text-danger' : 'text-sm text-ink-muted'} data-testid="usage-length" data-minutes={lengthMinutes}>
                {lengthMinutes <= 0 ? 'The session must end after it starts.' : `Session length: ${formatMinutes(lengthMinutes)}`}
                {refused && !readOnly && (
                  <span data-testid="outside-window-hint" className="ml-1 font-semibold text-danger">
                    — more than {usageWindow!.windowMinutes} min outside the booking; the facility does not accept these times.
                  </span>
                )}
                {leaves && !refused && !readOnly && (
                  <span data-testid="outside-grace-hint" className="ml-1 font-semibold text-caution-ink">
                    — more than {graceMinutes} min outside the booking; the log will be flagged for staff review.
                  </span>
                )}
              </p>
            )}
          </section>

          <section className="space-y-3">
            <h3 className="text-xs font-bold tracking-wider text-accent uppercase">2 · Segments: configuration, tuning range, power and pulse</h3>
            {errors.segments?.root?.message && <p className="text-sm font-semibold text-danger">{errors.segments.root.message}</p>}
            {segments.fields.map((field, index) => (
              <SegmentFields
                key={field.id}
                form={form}
                index={index}
                bookingId={booking.id}
                configurations={configurations}
                readOnly={readOnly}
                canRemove={segments.fields.length > 1}
                onRemove={() => segments.remove(index)}
                traceOnFile={loaded?.attachments.find((a) => a.id === values.segments[index]?.traceAttachmentId)}
              />
            ))}
            {!readOnly && (
              <Button
                variant="secondary"
                size="sm"
                data-testid="add-segment"
                disabled={segments.fields.length >= 20}
                onClick={() => {
                  const last = values.segments.at(-1);
                  segments.append(blankSegment(last?.configurationId ?? booking.configurationId, null, booking, timeZone));
                }}
              >
                Add a segment
              </Button>
            )}
          </section>

          <section className="space-y-3">
            <h3 className="text-xs font-bold tracking-wider text-accent uppercase">3 · Notes and attachments</h3>
            <label className="block space-y-1.5">
              <span className="block text-sm font-semibold">Session notes</span>
              <textarea
                rows={3}
                {...form.register('notes')}
                placeholder="What was measured, anything staff should know (alignment, faults, samples)"
                className="block w-full rounded-lg border border-line bg-panel px-3 py-2 text-sm"
              />
            </label>
            <AttachmentsField bookingId={booking.id} attachments={attachments} onChange={setAttachments} readOnly={readOnly} />
          </section>
        </fieldset>

        {failure && (
          <Notice tone="danger" testId="usage-error" title={failure.code === 'log_locked' ? 'This log is locked' : 'The log was not saved'}>
            <span data-code={failure.code}>{failure.message}</span>
          </Notice>
        )}
        {!readOnly && (
          <div className="flex items-center gap-3 border-t border-line pt-4">
            <Button type="submit" data-testid="save-usage" busy={save.isPending}>
              {log ? 'Save changes' : 'Save the session log'}
            </Button>
            <p className="text-xs text-ink-muted">Staff confirm each log before it is billed.</p>
          </div>
        )}
      </form>

      {canConfirm && log?.status === 'submitted' && <ConfirmPanel key={`${log.id}-${log.submittedAt}`} log={log} booking={booking} timeZone={timeZone} />}
    </div>
  );
}
