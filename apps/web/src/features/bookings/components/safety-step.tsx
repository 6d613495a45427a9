import { type AuthorisationGap, type BookingCheckDto, type PickerUnit, type TableRole, describeGaps } from '@femtoslot/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { bandText, roleLabels } from './request-check-panel';

/** Per wavelength on the table: the OD the laser-safety officer requires there and the eyewear rated for it. */
function OdByWavelength({ rows, unit }: { rows: BookingCheckDto['odByWavelength']; unit: PickerUnit }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-line" data-testid="on-table">
      <table className="w-full text-left text-sm">
        <caption className="px-3 pt-2.5 pb-1.5 text-left font-semibold">On the table (pump residual included) and the OD each wavelength needs</caption>
        <thead className="border-y border-line bg-sunk text-xs tracking-wide text-ink-muted uppercase">
          <tr>
            <th className="px-3 py-1.5">Output</th>
            <th className="px-3 py-1.5">Wavelength</th>
            <th className="px-3 py-1.5">Required OD</th>
            <th className="px-3 py-1.5">Eyewear rated for it</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.role} className="border-b border-line last:border-0" data-testid="od-row" data-role={row.role} data-required-od={row.requiredOd ?? ''}>
              <td className="px-3 py-1.5 font-semibold">{roleLabels[row.role as TableRole] ?? row.role}</td>
              <td className="px-3 py-1.5 tabular-nums text-ink-muted">{bandText(row, unit)}</td>
              <td className="px-3 py-1.5 tabular-nums">{row.requiredOd === null ? <span className="text-danger">not set</span> : `≥ ${row.requiredOd}`}</td>
              <td className="px-3 py-1.5">
                {row.eyewear.length ? row.eyewear.map((e) => e.label).join(', ') : <span className="font-semibold text-danger">none on the list</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The safety step of a request: every wavelength on the table, the OD each needs, and the eyewear that covers all of them. */
export function SafetyStep({ check, unit }: { check: BookingCheckDto | undefined; unit: PickerUnit }) {
  const wavelengths = check ? check.onTable.flatMap((band) => (band.minNm === band.maxNm ? [band.minNm] : [band.minNm, band.maxNm])) : [];
  const noneCovers = check !== undefined && check.onTable.length > 0 && check.eyewear.length === 0;
  const training = check?.problems.find((p) => p.code === 'training_required')?.details as { gaps: AuthorisationGap[] } | undefined;
  return (
    <div className="space-y-3">
      <LaserCaution wavelengthsNm={wavelengths} />
      {check && check.odByWavelength.length > 0 && <OdByWavelength rows={check.odByWavelength} unit={unit} />}
      {check && !noneCovers && check.eyewear.length > 0 && (
        <div data-testid="eyewear-covering" className="rounded-lg border border-success/40 bg-success-soft px-3 py-2.5 text-sm">
          <p className="font-semibold">Eyewear rated at the required OD for every wavelength above</p>
          <ul className="mt-1 list-disc pl-5">
            {check.eyewear.map((item) => (
              <li key={item.id} data-eyewear-id={item.id}>
                {item.label}
              </li>
            ))}
          </ul>
          <p className="mt-1.5 text-xs text-ink-muted">
            The required ODs are set by the facility's laser-safety officer; Femtoslot only compares ratings with them. Follow the officer's
            instructions and local rules.
          </p>
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
          No eyewear on the list is rated at the required OD for every wavelength on the table — ask the laser-safety officer.
        </Notice>
      )}
    </div>
  );
}
