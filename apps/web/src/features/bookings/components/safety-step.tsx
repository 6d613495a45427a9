import { type AuthorisationGap, type BookingCheckDto, type PickerUnit, describeGaps } from '@femtoslot/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { DerivedWavelengths } from './request-check-panel';

/** The safety step of a request: every wavelength on the table and the eyewear that covers all of them. */
export function SafetyStep({ check, unit }: { check: BookingCheckDto | undefined; unit: PickerUnit }) {
  const wavelengths = check ? check.onTable.flatMap((band) => (band.minNm === band.maxNm ? [band.minNm] : [band.minNm, band.maxNm])) : [];
  const noneCovers = check !== undefined && check.onTable.length > 0 && check.eyewear.length === 0;
  const training = check?.problems.find((p) => p.code === 'training_required')?.details as { gaps: AuthorisationGap[] } | undefined;
  return (
    <div className="space-y-3">
      <LaserCaution wavelengthsNm={wavelengths} />
      {check && check.onTable.length > 0 && (
        <div className="rounded-lg border border-line px-3 py-2.5" data-testid="on-table">
          <p className="mb-1.5 text-sm font-semibold">On the table (pump residual included)</p>
          <DerivedWavelengths bands={check.onTable} unit={unit} />
        </div>
      )}
      {check && !noneCovers && check.eyewear.length > 0 && (
        <div data-testid="eyewear-covering" data-required-od={check.requiredOd} className="rounded-lg border border-success/40 bg-success-soft px-3 py-2.5 text-sm">
          <p className="font-semibold">Eyewear that covers every wavelength above at OD ≥ {check.requiredOd}</p>
          <ul className="mt-1 list-disc pl-5">
            {check.eyewear.map((item) => (
              <li key={item.id} data-eyewear-id={item.id}>
                {item.label}
              </li>
            ))}
          </ul>
          <p className="mt-1.5 text-xs text-ink-muted">The required OD is set by the facility's laser-safety officer.</p>
        </div>
      )}
      {training && (
        <Notice tone="danger" testId="training-missing" title="You are not yet cleared for this configuration on that date">
          <ul className="list-disc pl-5">
            {training.gaps.map((g) => <li key={`${g.kind}-${g.name}`}>{describeGaps([g])}</li>)}
          </ul>
          <p className="mt-1.5">The laser-safety officer records training and sign-offs. <Link className="font-semibold underline" to={paths.training}>See your training</Link></p>
        </Notice>
      )}
      {noneCovers && (
        <Notice tone="danger" testId="no-eyewear" title="This request cannot be sent yet">
          No eyewear on the list covers every wavelength on the table at OD ≥ {check.requiredOd} — ask the laser-safety officer.
        </Notice>
      )}
    </div>
  );
}
