import { instrumentInputSchema, type InstrumentAdminDto, type InstrumentInput } from '@femtoslot/shared';
import { useState } from 'react';
import { SelectField, TextField } from '../../../components/ui/field';
import type { InstrumentChange } from '../api/save-instrument-change';
import { asText, fieldErrors, numberOrNull } from './form-bits';
import { ReviewAndSave } from './review-and-save';

type Draft = Record<keyof InstrumentInput, string | boolean>;

const blank: Draft = {
  name: '', kind: 'source', description: '', pumpNm: '800', retuneMinutesPerNm: '0.05',
  warmupAfterMaintenanceMinutes: '30', pulseCheckMinutes: '5', defaultChangeoverMinutes: '30', active: true,
};

function draftOf(i: InstrumentAdminDto): Draft {
  return {
    name: i.name, kind: i.kind, description: i.description, pumpNm: asText(i.pumpNm), retuneMinutesPerNm: asText(i.retuneMinutesPerNm),
    warmupAfterMaintenanceMinutes: asText(i.warmupAfterMaintenanceMinutes), pulseCheckMinutes: asText(i.pulseCheckMinutes),
    defaultChangeoverMinutes: asText(i.defaultChangeoverMinutes), active: i.active,
  };
}

const valuesOf = (d: Draft) => ({
  name: d.name, kind: d.kind, description: d.description, pumpNm: numberOrNull(String(d.pumpNm)),
  retuneMinutesPerNm: numberOrNull(String(d.retuneMinutesPerNm)), warmupAfterMaintenanceMinutes: numberOrNull(String(d.warmupAfterMaintenanceMinutes)),
  pulseCheckMinutes: numberOrNull(String(d.pulseCheckMinutes)), defaultChangeoverMinutes: numberOrNull(String(d.defaultChangeoverMinutes)), active: d.active,
});

/** Create or edit a source or bench: its pump and the instrument-wide parts of the changeover model. */
export function InstrumentForm({ instrument, timeZone, onSaved }: { instrument: InstrumentAdminDto | null; timeZone: string; onSaved?: () => void }) {
  const [draft, setDraft] = useState<Draft>(instrument ? draftOf(instrument) : blank);
  const parsed = instrumentInputSchema.safeParse(valuesOf(draft));
  const errors = fieldErrors(parsed);
  const change: InstrumentChange | null = !parsed.success ? null : instrument ? { kind: 'instrument', id: instrument.id, input: parsed.data } : { kind: 'create-instrument', input: parsed.data };
  const text = (key: keyof InstrumentInput, label: string, hint?: string) => (
    <TextField label={label} hint={hint} error={errors[key]} value={String(draft[key])} onChange={(e) => setDraft({ ...draft, [key]: e.target.value })} name={key} />
  );
  return (
    <form className="space-y-3" data-testid="instrument-form" onSubmit={(e) => e.preventDefault()} noValidate>
      <div className="grid gap-3 sm:grid-cols-2">
        {text('name', 'Name')}
        <SelectField label="Kind" value={String(draft.kind)} onChange={(e) => setDraft({ ...draft, kind: e.target.value })} name="kind">
          <option value="source">Source (tunable laser)</option>
          <option value="bench">Bench (measurement station)</option>
        </SelectField>
        {text('pumpNm', 'Pump wavelength (nm)', 'Blank for a bench without its own pump')}
        {text('retuneMinutesPerNm', 'Retune minutes per nm', 'Within one output; a configuration may override it')}
        {text('warmupAfterMaintenanceMinutes', 'Warm-up after maintenance (min)')}
        {text('pulseCheckMinutes', 'Pulse check (min)', 'After anything that touched the beam')}
        {text('defaultChangeoverMinutes', 'Default changeover (min)', 'For a pair of configurations not in the matrix')}
        {text('description', 'Description')}
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={Boolean(draft.active)} onChange={(e) => setDraft({ ...draft, active: e.target.checked })} name="active" />
        Active (bookable and shown on the calendar)
      </label>
      <ReviewAndSave change={change} timeZone={timeZone} onSaved={onSaved} label={instrument ? 'Save instrument' : 'Add instrument'} />
    </form>
  );
}
