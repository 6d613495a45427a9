import { outputKinds } from '@femtoslot/shared/facility/output-kinds';
import { configurationColour } from '../../lib/configuration-colour';

/** Key to the configuration colours: spectral for visible, labelled false colour for infrared. */
export function ConfigurationLegend() {
  return (
    <figure className="rounded-xl border border-line bg-panel px-4 py-3.5" data-testid="configuration-legend">
      <figcaption className="text-sm font-semibold">Configuration colours</figcaption>
      <ul className="mt-2.5 grid gap-2 text-sm sm:grid-cols-2">
        {outputKinds.map((kind) => {
          const colour = configurationColour(kind);
          return (
            <li key={kind} className="flex items-center gap-2.5">
              <span aria-hidden="true" className="h-3 w-7 shrink-0 rounded-sm" style={{ background: colour.background }} />
              <span className="text-ink-muted">{colour.legend}</span>
            </li>
          );
        })}
      </ul>
      <p className="mt-2.5 text-xs text-ink-muted">
        Infrared is invisible; its colours are a key only. Visible outputs use their approximate spectral hue.
      </p>
    </figure>
  );
}
