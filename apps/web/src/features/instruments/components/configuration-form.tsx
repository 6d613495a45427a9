import { configurationValuesSchema, outputKindLabels, outputKinds, type InstrumentAdminDto, type RequiredOdBand } from '@femtoslot/shared';
import { useState } from 'react';
import { SelectField, TextField } from '../../../components/ui/field';
import { OdBandsField } from './od-bands-field';
import type { InstrumentChange } from '../api/save-instrument-change';
import { asText, fieldErrors, numberOrNull } from './form-bits';
import { ReviewAndSave } from './review-and-save';

type Configuration = InstrumentAdminDto['configurations'][number];
interface Draft {
  key: string; name: string; outputKind: string; minNm: string; maxNm: string; defaultNm: string; rateClass: string;
  requiredOdBands: RequiredOdBand[]; retuneMinutesPerNm: string; active: boolean;
}

const blank: Draft = {
  key: '', name: '', outputKind: 'fundamental', minNm: '', maxNm: '', defaultNm: '', rateClass: 'standard',
  requiredOdBands: [{ minNm: 700, maxNm: 1100, od: 7 }], retuneMinutesPerNm: '', active: true,
};

const draftOf = (c: Configuration): Draft => ({
  key: c.key, name: c.name, outputKind: c.outputKind, minNm: asText(c.minNm), maxNm: asText(c.maxNm), defaultNm: asText(c.defaultNm),
  rateClass: c.rateClass, requiredOdBands: c.requiredOdBands, retuneMinutesPerNm: asText(c.retuneMinutesPerNm), active: c.active,
});

const valuesOf = (d: Draft) => ({
  ...d, minNm: numberOrNull(d.minNm), maxNm: numberOrNull(d.maxNm), defaultNm: numberOrNull(d.defaultNm), retuneMinutesPerNm: numberOrNull(d.retuneMinutesPerNm),
});

/**
 * Create or edit one output of an instrument. The required ODs are the laser-safety officer's: staff record them here;
 * every wavelength the output can put on the table (pump residual and partners included) needs one.
 */
export function ConfigurationForm({ instrumentId, configuration, timeZone, onSaved }: { instrumentId: string; configuration: Configuration | null; timeZone: string; onSaved?: () => void }) {
  const [draft, setDraft] = useState<Draft>(configuration ? draftOf(configuration) : blank);
  const parsed = configurationValuesSchema.safeParse(valuesOf(draft));
  const errors = fieldErrors(parsed);
  const change: InstrumentChange | null = !parsed.success
    ? null
    : configuration
      ? { kind: 'configuration', id: configuration.id, input: parsed.data }
      : { kind: 'create-configuration', input: { ...parsed.data, instrumentId } };
  const text = (key: 'key' | 'name' | 'minNm' | 'maxNm' | 'defaultNm' | 'retuneMinutesPerNm', label: string, hint?: string) => (
    <TextField label={label} hint={hint} error={errors[key]} value={draft[key]} onChange={(e) => setDraft({ ...draft, [key]: e.target.value })} name={key} />
  );
  return (
    <form className="space-y-3 rounded-lg border border-line bg-sunk/50 p-3" data-testid="configuration-form" onSubmit={(e) => e.preventDefault()} noValidate>
      <div className="grid gap-3 sm:grid-cols-3">
        {text('name', 'Name')}
        {text('key', 'Key', 'Used by the changeover matrix, e.g. opa_signal')}
        <SelectField label="Output kind" value={draft.outputKind} onChange={(e) => setDraft({ ...draft, outputKind: e.target.value })} name="outputKind">
          {outputKinds.map((k) => (
            <option key={k} value={k}>
              {outputKindLabels[k]}
            </option>
          ))}
        </SelectField>
        {text('minNm', 'Tuning range from (nm)')}
        {text('maxNm', 'Tuning range to (nm)')}
        {text('defaultNm', 'Default wavelength (nm)')}
        <SelectField label="Rate class" value={draft.rateClass} onChange={(e) => setDraft({ ...draft, rateClass: e.target.value })} name="rateClass">
          <option value="standard">Standard</option>
          <option value="dfg">DFG</option>
        </SelectField>
        {text('retuneMinutesPerNm', 'Retune minutes per nm', 'Blank: the instrument’s figure')}
      </div>
      <div className="space-y-1">
        <p className="text-sm font-semibold">Required OD per wavelength band</p>
        <p className="text-xs text-ink-muted">
          Set by the facility’s laser-safety officer (ANSI Z136.1 / IEC 60825-1 and local rules). Where bands overlap, the higher OD applies.
        </p>
        <OdBandsField label="Required OD" value={draft.requiredOdBands} onChange={(requiredOdBands) => setDraft({ ...draft, requiredOdBands })} />
        {errors.requiredOdBands && <p className="text-xs font-semibold text-danger">{errors.requiredOdBands}</p>}
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={draft.active} onChange={(e) => setDraft({ ...draft, active: e.target.checked })} name="active" />
        Active (offered in requests)
      </label>
      <ReviewAndSave change={change} timeZone={timeZone} onSaved={onSaved} label={configuration ? 'Save configuration' : 'Add configuration'} />
    </form>
  );
}
