import type { BookingCheckDto, CreateBookingInput } from '@femtoslot/shared';
import { describeInstant, formatInstantsIn } from '@femtoslot/shared/time/format-instant';
import { zodResolver } from '@hookform/resolvers/zod';
import { type ReactNode, useEffect, useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { formatInstant, formatMinutes, instantToFields, viewerTimeZone } from '../../../lib/wall-time';
import { useBookingCheck } from '../api/check-booking';
import { useCreateBooking } from '../api/create-booking';
import { type ChangeoverGapDetails, changeoverGapDetails } from '../lib/changeover-gap';
import { type RequestFormValues, buildRequest, requestFormSchema, serverFieldFor } from '../lib/request-form-values';
import { requestVerdict } from '../lib/request-verdict';
import { RequestCheckPanel } from './request-check-panel';
import { type RequestConfiguration, TargetFields, TimeFields, defaultTargetText } from './request-form-fields';
import { SafetyStep } from './safety-step';
import { StationPicker } from './station-picker';

export interface RequestFormProps {
  open: boolean;
  onClose: () => void;
  timeZone: string;
  instruments: { id: string; name: string; kind: string; pumpNm?: number | null }[];
  configurations: RequestConfiguration[];
  accounts: { id: string; name: string; usable: boolean; reason: string | null }[];
  initial: { instrumentId?: string; startsAt?: string; endsAt?: string };
  /** shown until the live check brings the facility's own wording */
  policyText: string;
  limits?: { minBookingHours: number; maxBookingHours: number };
  /** the live price of the request, composed by the page (features/estimates) */
  estimate?: (body: CreateBookingInput | null) => ReactNode;
}

export function RequestForm(props: RequestFormProps) {
  return (
    <Dialog
      open={props.open}
      onClose={props.onClose}
      size="lg"
      title="Request beam time"
      description="Checked live against the neighbours, the tuning range and the eyewear on the list."
      testId="request-dialog"
    >
      <RequestFormBody {...props} />
    </Dialog>
  );
}

function initialValues({ instruments, configurations, accounts, initial, timeZone }: RequestFormProps): RequestFormValues {
  // Asked from a bench's calendar: the beam comes from the source, with that bench as an end station.
  const bench = instruments.find((i) => i.id === initial.instrumentId && i.kind === 'bench');
  const instrumentId = (bench ? undefined : initial.instrumentId) ?? instruments.find((i) => i.kind === 'source')?.id ?? instruments[0]?.id ?? '';
  const configuration = configurations.find((c) => c.instrumentId === instrumentId);
  const tomorrow = new Date(Date.now() + 86_400_000);
  tomorrow.setUTCMinutes(0, 0, 0);
  const start = instantToFields(initial.startsAt ?? tomorrow, timeZone);
  const end = instantToFields(initial.endsAt ?? new Date(tomorrow.getTime() + 3 * 3_600_000), timeZone);
  return {
    instrumentId,
    configurationId: configuration?.id ?? '',
    targetMode: 'single',
    targetValue: configuration ? defaultTargetText(configuration.defaultNm, 'nm') : '',
    targetToValue: '',
    unit: 'nm',
    startDate: start.date,
    startTime: start.time,
    endDate: end.date,
    endTime: end.time,
    accountId: accounts.find((a) => a.usable)?.id ?? '',
    purpose: '',
    stationIds: bench ? [bench.id] : [],
  };
}

// The dry run needs a purpose to pass validation; before one is typed it checks everything else.
const placeholderPurpose = 'Beam time (purpose not yet given)';

function RequestFormBody(props: RequestFormProps) {
  const { timeZone, configurations, instruments, accounts, onClose } = props;
  const form = useForm<RequestFormValues>({ resolver: zodResolver(requestFormSchema), defaultValues: initialValues(props) });
  const values = useWatch({ control: form.control }) as RequestFormValues;
  const create = useCreateBooking();
  const [gap, setGap] = useState<ChangeoverGapDetails | null>(null);
  const [refusal, setRefusal] = useState<{ code: string; message: string } | null>(null);

  const instrument = instruments.find((i) => i.id === values.instrumentId);
  const instrumentConfigurations = configurations.filter((c) => c.instrumentId === values.instrumentId);
  const configuration = configurations.find((c) => c.id === values.configurationId);
  const built = useMemo(() => buildRequest(values, timeZone), [values, timeZone]);

  const checkKey = built && built.minutes > 0 && values.accountId ? JSON.stringify(built.body) : null;
  const settledKey = useDebouncedValue(checkKey, 300);
  const checkBody = useMemo<CreateBookingInput | null>(() => {
    if (!settledKey) return null;
    const body = JSON.parse(settledKey) as CreateBookingInput;
    return body.purpose.trim().length >= 3 ? body : { ...body, purpose: placeholderPurpose };
  }, [settledKey]);
  const check = useBookingCheck(checkBody);
  const checkData: BookingCheckDto | undefined = checkKey ? check.data : undefined;
  const noEyewear = checkData !== undefined && checkData.onTable.length > 0 && checkData.eyewear.length === 0;
  const refused = checkData !== undefined && requestVerdict(checkData).refuses;

  useEffect(() => {
    setGap(null);
    setRefusal(null);
  }, [checkKey]);

  const onInstrumentChange = (instrumentId: string) => {
    const first = configurations.find((c) => c.instrumentId === instrumentId);
    form.setValue('configurationId', first?.id ?? '');
    if (first) form.setValue('targetValue', defaultTargetText(first.defaultNm, form.getValues('unit')));
  };
  const onConfigurationChange = (configurationId: string) => {
    const next = configurations.find((c) => c.id === configurationId);
    if (next) form.setValue('targetValue', defaultTargetText(next.defaultNm, form.getValues('unit')));
  };

  const applyEarliestStart = (earliestStart: string) => {
    const minutes = built && built.minutes > 0 ? built.minutes : 60;
    const start = instantToFields(earliestStart, timeZone);
    const end = instantToFields(new Date(new Date(earliestStart).getTime() + minutes * 60_000), timeZone);
    form.setValue('startDate', start.date);
    form.setValue('startTime', start.time);
    form.setValue('endDate', end.date);
    form.setValue('endTime', end.time);
    setGap(null);
  };

  const onSubmit = form.handleSubmit((formValues) => {
    const request = buildRequest(formValues, timeZone);
    if (!request) return;
    if (request.minutes <= 0) {
      form.setError('endTime', { type: 'validate', message: 'The end must be after the start' });
      return;
    }
    setGap(null);
    setRefusal(null);
    create.mutate(request.body, {
      onSuccess: ({ booking, changeover }) => {
        toast.success(booking.status === 'approved' ? 'Beam time booked' : 'Request sent for staff approval', {
          description: `${formatInstant(booking.startsAt, timeZone)} · changeover ${changeover.beforeMinutes} min before, ${changeover.afterMinutes} min after`,
        });
        onClose();
      },
      onError: (error) => {
        if (!isApiError(error)) return void toast.error(error.message);
        if (error.code === 'changeover_gap') {
          setGap(changeoverGapDetails(error.details) ?? { neededMinutes: 0, availableMinutes: 0, earliestStart: null });
          return;
        }
        if (error.code === 'validation_failed' && Array.isArray(error.details)) {
          for (const issue of error.details as { path?: unknown[]; message?: string }[]) {
            const field = serverFieldFor[String(issue.path?.[0] ?? '')];
            if (field && issue.message) form.setError(field, { type: 'server', message: issue.message });
          }
        }
        setRefusal({ code: error.code, message: error.message });
      },
    });
  });

  const status = checkData?.status;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6" data-testid="request-form">
      <section className="space-y-4">
        <h3 className="text-xs font-bold tracking-wider text-accent uppercase">1 · Configuration and target</h3>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField label="Instrument" {...form.register('instrumentId', { onChange: (e) => onInstrumentChange(e.target.value) })}>
            {instruments.map((i) => (
              <option key={i.id} value={i.id}>
                {i.name}
              </option>
            ))}
          </SelectField>
          <SelectField
            label="Configuration"
            hint={configuration ? `Tuning range ${configuration.minNm}–${configuration.maxNm} nm` : undefined}
            error={form.formState.errors.configurationId?.message}
            {...form.register('configurationId', { onChange: (e) => onConfigurationChange(e.target.value) })}
          >
            {instrumentConfigurations.length === 0 && <option value="">No configurations on this instrument</option>}
            {instrumentConfigurations.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} ({c.minNm}–{c.maxNm} nm)
              </option>
            ))}
          </SelectField>
        </div>
        <TargetFields form={form} configuration={configuration} pumpNm={instrument?.pumpNm ?? null} />
        <StationPicker form={form} />
      </section>

      <section className="space-y-4">
        <h3 className="text-xs font-bold tracking-wider text-accent uppercase">2 · Time, account and purpose</h3>
        <TimeFields form={form} timeZone={timeZone} built={built} limits={props.limits} />
        <div className="rounded-lg border border-line px-3 py-2.5">
          <p className="mb-1.5 text-sm font-semibold">Changeover against the neighbours</p>
          <RequestCheckPanel
            check={checkData}
            checking={check.isFetching}
            error={checkKey && check.error ? check.error.message : null}
            timeZone={timeZone}
            onUseEarliest={applyEarliestStart}
          />
        </div>
        <SelectField label="Account" error={form.formState.errors.accountId?.message} {...form.register('accountId')}>
          {accounts.length === 0 && <option value="">Your organisation has no account yet</option>}
          {accounts.map((a) => (
            <option key={a.id} value={a.id} disabled={!a.usable}>
              {a.name}
              {!a.usable && a.reason ? ` — ${a.reason}` : ''}
            </option>
          ))}
        </SelectField>
        <TextField label="Purpose" placeholder="e.g. CH₄ absorption lines for a gas-sensor prototype" error={form.formState.errors.purpose?.message} {...form.register('purpose')} />
      </section>

      <section className="space-y-3">
        <h3 className="text-xs font-bold tracking-wider text-accent uppercase">3 · Safety</h3>
        <SafetyStep check={checkData} unit={values.unit} />
      </section>

      {gap && (
        <Notice tone="danger" testId="changeover-gap-error" title="Not enough time for the changeover">
          <p>
            Needed {formatMinutes(gap.neededMinutes)}, available {formatMinutes(gap.availableMinutes)}.
            {gap.earliestStart && ` The earliest start that works is ${describeInstant(gap.earliestStart, timeZone, viewerTimeZone())}.`}
          </p>
          {gap.earliestStart && (
            <Button size="sm" className="mt-2" data-testid="use-earliest-start" onClick={() => applyEarliestStart(gap.earliestStart!)}>
              Use {formatInstant(gap.earliestStart, timeZone).split(', ').pop()}
            </Button>
          )}
        </Notice>
      )}
      {refusal && (
        <Notice tone="danger" testId="request-refused" title="The request was not accepted">
          <span data-code={refusal.code}>{formatInstantsIn(refusal.message, timeZone, viewerTimeZone())}</span>
        </Notice>
      )}

      <div className="space-y-2 border-t border-line pt-4 text-sm">
        {status && (
          <p data-testid="request-outcome" data-status={status} className="font-semibold">
            {status === 'approved' ? 'This will be approved at once.' : 'This will be a request for staff approval.'}
          </p>
        )}
        {props.estimate?.(checkBody)}
        <p data-testid="cancellation-policy" className="text-ink-muted">
          {checkData?.cancellationPolicy || props.policyText}
        </p>
        <div className="flex justify-end gap-2 pt-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" busy={create.isPending} disabled={noEyewear || refused} data-testid="submit-request">
            {status === 'approved' ? 'Book beam time' : 'Send request'}
          </Button>
        </div>
      </div>
    </form>
  );
}
