import { type OutputKind, outputKinds } from '@femtoslot/shared/facility/output-kinds';
import { configurationColour } from '../../lib/configuration-colour';

export const isOutputKind = (value: string): value is OutputKind => (outputKinds as readonly string[]).includes(value);

/** A configuration's name beside its colour swatch (spectral hue, or the labelled false-colour key for infrared). */
export function ConfigurationChip({ name, outputKind }: { name: string; outputKind: string }) {
  const colour = isOutputKind(outputKind) ? configurationColour(outputKind) : null;
  return (
    <span className="inline-flex items-center gap-2" data-output-kind={outputKind}>
      <span
        aria-hidden="true"
        className="h-3 w-5 shrink-0 rounded-sm border border-black/10"
        style={{ background: colour?.background ?? 'var(--color-line)' }}
        title={colour?.legend}
      />
      <span>{name}</span>
    </span>
  );
}
