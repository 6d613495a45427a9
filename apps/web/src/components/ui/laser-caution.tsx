import { useId } from 'react';
import { cx } from '../../lib/cx';

export interface LaserCautionProps {
  /** wavelengths present on the table, pump residual included */
  wavelengthsNm?: readonly number[];
  className?: string;
}

const nmFormat = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

function CautionMark() {
  return (
    <svg viewBox="0 0 24 24" aria-hidden="true" className="size-6 shrink-0 text-caution-line">
      <path d="M12 2.8 22.2 20.5H1.8Z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
      <path d="M12 9v5.6" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      <circle cx="12" cy="17.6" r="1.2" fill="currentColor" />
    </svg>
  );
}

/** The standing Class 4 caution. Femtoslot points to the laser-safety officer; it never declares a setup safe. */
export function LaserCaution({ wavelengthsNm, className }: LaserCautionProps) {
  const titleId = useId();
  const wavelengths = wavelengthsNm ? [...new Set(wavelengthsNm)].sort((a, b) => a - b) : [];
  return (
    <aside
      role="note"
      aria-labelledby={titleId}
      data-testid="laser-caution"
      className={cx(
        'rounded-xl border border-caution-line/60 border-l-4 border-l-caution-line bg-caution-bg px-4 py-3.5 text-sm text-caution-ink',
        className,
      )}
    >
      <div className="flex gap-3">
        <CautionMark />
        <div className="space-y-2">
          <p id={titleId} className="font-bold">
            Class 4 laser radiation
          </p>
          <ul className="list-disc space-y-1 pl-4">
            <li>The direct or scattered beam can injure eyes and skin, and can start a fire.</li>
            <li>
              Wear eyewear rated for every wavelength on the table, at the optical density (OD) set by the facility's
              laser-safety officer.
            </li>
            <li>Follow the laser-safety officer's instructions, ANSI Z136.1, IEC 60825-1 and local rules.</li>
          </ul>
          {wavelengths.length > 0 && (
            <p data-testid="laser-caution-wavelengths">
              <span className="font-semibold">Wavelengths on the table: </span>
              {wavelengths.map((nm) => `${nmFormat.format(nm)} nm`).join(', ')}
            </p>
          )}
          <p className="text-xs opacity-90">Femtoslot does not assess or certify whether a setup is safe.</p>
        </div>
      </div>
    </aside>
  );
}
