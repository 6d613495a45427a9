import { type PickerUnit, checkTargetFeasibility, fromNm, pickerUnits } from '@femtoslot/shared';
import { useRef } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { formatMinutes } from '../../../lib/wall-time';
import type { BuiltRequest, RequestFormValues } from '../lib/request-form-values';
import { convertTyped, targetToNm, unitLabels } from '../lib/target-units';
import { DerivedWavelengths, bandText } from './request-check-panel';

/** What the request form needs to know about a configuration (the configurations feature's rows fit). */
export interface RequestConfiguration {
  id: string;
  instrumentId: string;
  name: string;
  outputKind: string;
  minNm: number;
  maxNm: number;
  defaultNm: number;
}

type Form = UseFormReturn<RequestFormValues>;

export function defaultTargetText(nm: number, unit: PickerUnit): string {
  const value = fromNm(nm, unit);
  return String(Number(value.toFixed(unit === 'um' ? 4 : 2)));
}

export function TargetFields({ form, configuration, pumpNm }: { form: Form; configuration: RequestConfiguration | undefined; pumpNm: number | null }) {
  const { register, setValue, getValues, watch, formState } = form;
  const unit = watch('unit');
  const mode = watch('targetMode');
  const previousUnit = useRef<PickerUnit>(unit);
  const target = targetToNm(mode, watch('targetValue'), watch('targetToValue'), unit);
  const feasibility =
    target && configuration
      ? checkTargetFeasibility(target, {
          outputKind: configuration.outputKind as never,
          minNm: configuration.minNm,
          maxNm: configuration.maxNm,
          name: configuration.name,
          ...(pumpNm ? { pumpNm } : {}),
        })
      : null;

  const onUnitChange = (next: PickerUnit) => {
    const from = previousUnit.current;
    setValue('targetValue', convertTyped(getValues('targetValue'), from, next));
    setValue('targetToValue', convertTyped(getValues('targetToValue'), from, next));
    previousUnit.current = next;
  };

  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-semibold">Target wavelength</legend>
      <div className="flex gap-4 text-sm" role="radiogroup" aria-label="Target kind">
        <label className="flex items-center gap-1.5">
          <input type="radio" value="single" {...register('targetMode')} /> One wavelength
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" value="range" {...register('targetMode')} /> A range (a scan)
        </label>
      </div>
      <div className="grid grid-cols-[1fr_1fr_7rem] gap-3">
        <TextField
          label={mode === 'range' ? 'From' : 'Target'}
          inputMode="decimal"
          autoComplete="off"
          error={formState.errors.targetValue?.message}
          {...register('targetValue')}
        />
        {mode === 'range' ? (
          <TextField label="To" inputMode="decimal" autoComplete="off" error={formState.errors.targetToValue?.message} {...register('targetToValue')} />
        ) : (
          <div />
        )}
        <SelectField label="Unit" {...register('unit', { onChange: (event) => onUnitChange(event.target.value as PickerUnit) })}>
          {pickerUnits.map((u) => (
            <option key={u} value={u}>
              {unitLabels[u]}
            </option>
          ))}
        </SelectField>
      </div>
      {target && unit !== 'nm' && (
        <p className="text-xs text-ink-muted" data-testid="target-nm">
          Sent as {'targetNm' in target ? `${target.targetNm} nm` : `${target.minNm}–${target.maxNm} nm`}
        </p>
      )}
      {feasibility && (
        <p
          data-testid="in-range-verdict"
          data-in-range={feasibility.reasons.every((r) => r.code !== 'out_of_range')}
          className={feasibility.feasible ? 'text-sm text-success' : 'text-sm font-semibold text-danger'}
        >
          {feasibility.feasible
            ? `✓ Within ${configuration!.name}'s tuning range ${bandText(configuration!, unit)}`
            : feasibility.reasons.map((r) => r.message).join(' · ')}
        </p>
      )}
      {feasibility && feasibility.onTable.length > 0 && (
        <div className="rounded-lg bg-sunk px-3 py-2.5">
          <p className="mb-1.5 text-xs font-bold tracking-wide text-ink-muted uppercase">Derived wavelengths</p>
          <DerivedWavelengths bands={feasibility.onTable} unit={unit} />
        </div>
      )}
    </fieldset>
  );
}

export interface TimeFieldsProps {
  form: Form;
  timeZone: string;
  built: BuiltRequest | null;
  limits?: { minBookingHours: number; maxBookingHours: number };
}

export function TimeFields({ form, timeZone, built, limits }: TimeFieldsProps) {
  const { register, formState } = form;
  const notes = [built?.start.note, built?.end.note].filter((n): n is string => Boolean(n));
  const length = built?.minutes ?? null;
  const outside = limits && length !== null && (length < limits.minBookingHours * 60 || length > limits.maxBookingHours * 60);
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-semibold">
        When <span className="font-normal text-ink-muted">— wall-clock time in {timeZone} (facility time)</span>
      </legend>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <TextField label="Start date" type="date" error={formState.errors.startDate?.message} {...register('startDate')} />
        <TextField label="Start time" type="time" step={900} error={formState.errors.startTime?.message} {...register('startTime')} />
        <TextField label="End date" type="date" error={formState.errors.endDate?.message} {...register('endDate')} />
        <TextField label="End time" type="time" step={900} error={formState.errors.endTime?.message} {...register('endTime')} />
      </div>
      {notes.map((note) => (
        <Notice key={note} testId="wall-time-note" title="Clock change">
          {note}
        </Notice>
      ))}
      {length !== null && (
        <p data-testid="booking-length" data-minutes={length} className={outside || length <= 0 ? 'text-sm font-semibold text-danger' : 'text-sm text-ink-muted'}>
          {length <= 0 ? 'The end must be after the start.' : `Length: ${formatMinutes(length)}`}
          {limits && length > 0 && ` (bookings run ${limits.minBookingHours}–${limits.maxBookingHours} h)`}
        </p>
      )}
    </fieldset>
  );
}
