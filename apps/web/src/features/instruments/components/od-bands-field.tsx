import type { RequiredOdBand } from '@femtoslot/shared';
import { Button } from '../../../components/ui/button';

const input = 'w-24 rounded-lg border border-line bg-panel px-2 py-1 text-sm tabular-nums';

/** Required OD per wavelength band, as the laser-safety officer sets them; where bands overlap the higher OD applies. */
export function OdBandsField({ value, onChange, label }: { value: RequiredOdBand[]; onChange: (bands: RequiredOdBand[]) => void; label: string }) {
  const set = (index: number, key: keyof RequiredOdBand, raw: string) =>
    onChange(value.map((band, i) => (i === index ? { ...band, [key]: raw === '' ? Number.NaN : Number(raw) } : band)));
  return (
    <fieldset className="space-y-1.5" data-testid="od-bands">
      <legend className="sr-only">{label}</legend>
      {value.map((band, index) => (
        <div key={index} className="flex flex-wrap items-center gap-1.5 text-sm" data-testid="od-band">
          <input className={input} type="number" step="any" aria-label={`${label}: band ${index + 1} from nm`} value={Number.isNaN(band.minNm) ? '' : band.minNm} onChange={(e) => set(index, 'minNm', e.target.value)} />
          <span className="text-ink-muted">–</span>
          <input className={input} type="number" step="any" aria-label={`${label}: band ${index + 1} to nm`} value={Number.isNaN(band.maxNm) ? '' : band.maxNm} onChange={(e) => set(index, 'maxNm', e.target.value)} />
          <span className="text-ink-muted">nm, OD ≥</span>
          <input className="w-16 rounded-lg border border-line bg-panel px-2 py-1 text-sm tabular-nums" type="number" step="0.5" min={0} max={12} aria-label={`${label}: band ${index + 1} OD`} value={Number.isNaN(band.od) ? '' : band.od} onChange={(e) => set(index, 'od', e.target.value)} />
          <Button variant="quiet" size="sm" aria-label={`Remove band ${index + 1}`} disabled={value.length === 1} onClick={() => onChange(value.filter((_, i) => i !== index))}>
            Remove
          </Button>
        </div>
      ))}
      <Button variant="secondary" size="sm" data-testid="add-od-band" onClick={() => onChange([...value, { ...(value[value.length - 1] ?? { minNm: 700, maxNm: 1100, od: 5 }) }])}>
        Add band
      </Button>
    </fieldset>
  );
}

export const odBandsText = (bands: RequiredOdBand[]) => bands.map((b) => `${b.minNm}–${b.maxNm} nm: OD ≥ ${b.od}`).join('; ');
