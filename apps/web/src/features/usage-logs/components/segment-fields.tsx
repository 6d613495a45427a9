import { type AttachmentDto, type PickerUnit, pickerUnits } from '@femtoslot/shared';
import { useRef } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { isOutputKind } from '../../../components/ui/configuration-chip';
import { SelectField, TextField } from '../../../components/ui/field';
import { configurationColour } from '../../../lib/configuration-colour';
import { convertTyped, parsePositive, rangeText, rangeToNm, unitLabels } from '../lib/range-units';
import type { UsageFormValues } from '../lib/usage-form-values';
import { TraceUpload } from './trace-upload';

/** What the log form needs to know about a configuration (the configurations feature's rows fit). */
export interface UsageConfiguration {
  id: string;
  name: string;
  outputKind: string;
  minNm: number;
  maxNm: number;
}

export interface SegmentFieldsProps {
  form: UseFormReturn<UsageFormValues>;
  index: number;
  bookingId: string;
  configurations: UsageConfiguration[];
  readOnly: boolean;
  canRemove: boolean;
  onRemove: () => void;
  traceOnFile?: AttachmentDto;
}

export function SegmentFields({ form, index, bookingId, configurations, readOnly, canRemove, onRemove, traceOnFile }: SegmentFieldsProps) {
  const { register, watch, setValue, getValues, formState } = form;
  const errors = formState.errors.segments?.[index];
  const segment = watch(`segments.${index}`);
  const configuration = configurations.find((c) => c.id === segment.configurationId);
  const colour = configuration && isOutputKind(configuration.outputKind) ? configurationColour(configuration.outputKind) : null;
  const range = rangeToNm(segment.minValue, segment.maxValue, segment.unit);
  const outside = range && configuration && (range.minNm < configuration.minNm || range.maxNm > configuration.maxNm);
  const previousUnit = useRef<PickerUnit>(segment.unit);

  const onUnitChange = (next: PickerUnit) => {
    const from = previousUnit.current;
    setValue(`segments.${index}.minValue` as const, convertTyped(getValues(`segments.${index}.minValue` as const), from, next));
    setValue(`segments.${index}.maxValue` as const, convertTyped(getValues(`segments.${index}.maxValue` as const), from, next));
    previousUnit.current = next;
  };

  return (
    <fieldset
      data-testid="usage-segment"
      data-index={index}
      className="space-y-4 rounded-xl border border-line border-l-4 bg-panel px-4 py-4"
      style={{ borderLeftColor: colour?.hex ?? 'var(--color-line)' }}
    >
      <div className="flex items-center justify-between gap-3">
        <legend className="text-sm font-bold">Segment {index + 1}</legend>
        {canRemove && !readOnly && (
          <Button size="sm" variant="quiet" onClick={onRemove} data-testid="remove-segment">
            Remove segment
          </Button>
        )}
      </div>

      <div className="grid gap-3 sm:grid-cols-[1.3fr_1fr_1fr_6.5rem]">
        <SelectField
          label="Configuration"
          hint={configuration ? `Tuning range ${rangeText(configuration)}${colour ? ` · ${colour.legend}` : ''}` : undefined}
          error={errors?.configurationId?.message}
          {...register(`segments.${index}.configurationId` as const)}
        >
          {configurations.length === 0 && <option value="">No configurations on this instrument</option>}
          {configurations.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Range covered from" inputMode="decimal" autoComplete="off" error={errors?.minValue?.message} {...register(`segments.${index}.minValue` as const)} />
        <TextField label="to" inputMode="decimal" autoComplete="off" error={errors?.maxValue?.message} {...register(`segments.${index}.maxValue` as const)} />
        <SelectField label="Unit" {...register(`segments.${index}.unit` as const, { onChange: (event) => onUnitChange(event.target.value as PickerUnit) })}>
          {pickerUnits.map((u) => (
            <option key={u} value={u}>
              {unitLabels[u]}
            </option>
          ))}
        </SelectField>
      </div>
      {range && (
        <p className={outside ? 'text-sm font-semibold text-danger' : 'text-xs text-ink-muted'} data-testid="segment-range-nm" data-min-nm={range.minNm} data-max-nm={range.maxNm}>
          {outside
            ? `${rangeText(range)} leaves ${configuration.name}'s tuning range ${rangeText(configuration)}; the log will be refused.`
            : `Logged as ${rangeText(range)}.`}
        </p>
      )}

      <div className="space-y-3">
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register(`segments.${index}.wholeSession` as const)} /> This segment lasted the whole session
        </label>
        {!segment.wholeSession && (
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <TextField label="Segment start date" type="date" error={errors?.startDate?.message} {...register(`segments.${index}.startDate` as const)} />
            <TextField label="Start time" type="time" error={errors?.startTime?.message} {...register(`segments.${index}.startTime` as const)} />
            <TextField label="Segment end date" type="date" error={errors?.endDate?.message} {...register(`segments.${index}.endDate` as const)} />
            <TextField label="End time" type="time" error={errors?.endTime?.message} {...register(`segments.${index}.endTime` as const)} />
          </div>
        )}
      </div>

      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="Average power (mW)" inputMode="decimal" autoComplete="off" error={errors?.averagePowerMw?.message} {...register(`segments.${index}.averagePowerMw` as const)} />
        <TextField
          label="Pulse duration, FWHM (fs)"
          inputMode="decimal"
          autoComplete="off"
          hint={segment.traceAttachmentId ? 'From the autocorrelation trace below' : 'Type it, or compute it from a trace below'}
          error={errors?.pulseFwhmFs?.message}
          {...register(`segments.${index}.pulseFwhmFs` as const, { onChange: () => setValue(`segments.${index}.traceAttachmentId` as const, '') })}
        />
        <SelectField label="Assumed pulse shape" {...register(`segments.${index}.pulseShape` as const)}>
          <option value="gaussian">Gaussian (AC ÷ 1.414)</option>
          <option value="sech2">sech² (AC ÷ 1.543)</option>
        </SelectField>
        <TextField
          label="Spectral FWHM (nm)"
          inputMode="decimal"
          autoComplete="off"
          hint="Optional: checks the pulse against the transform limit"
          error={errors?.spectralFwhmNm?.message}
          {...register(`segments.${index}.spectralFwhmNm` as const)}
        />
      </div>

      <div className={readOnly && !traceOnFile ? 'hidden' : undefined}>
        <p className="mb-1.5 text-sm font-semibold">Pulse duration from an autocorrelation trace</p>
        <TraceUpload
          bookingId={bookingId}
          shape={segment.pulseShape}
          centreNm={range?.minNm}
          spectralFwhmNm={parsePositive(segment.spectralFwhmNm) ?? undefined}
          colour={colour?.hex ?? 'var(--color-accent)'}
          disabled={readOnly}
          existing={traceOnFile}
          onResult={(outcome) => {
            setValue(`segments.${index}.pulseFwhmFs` as const, String(outcome.pulseFwhmFs), { shouldDirty: true, shouldValidate: true });
            setValue(`segments.${index}.traceAttachmentId` as const, outcome.traceAttachmentId, { shouldDirty: true });
            setValue(`segments.${index}.pulseShape` as const, outcome.shape, { shouldDirty: true });
          }}
        />
      </div>

      <TextField label="Segment notes" placeholder="e.g. scanned in 5 nm steps, pump-probe on InGaAs sample B" error={errors?.notes?.message} {...register(`segments.${index}.notes` as const)} />
    </fieldset>
  );
}
