import type { OutputKind } from '@femtoslot/shared';

export interface ConfigurationColour {
  outputKind: OutputKind;
  /** a single colour for dots, borders and chart series */
  hex: string;
  /** CSS background value; DFG runs along a ramp, the rest are flat */
  background: string;
  /** visible outputs are drawn in their spectral hue; infrared ones in labelled false colour */
  falseColour: boolean;
  /** short legend text, e.g. "SHG · visible ~400 nm" */
  legend: string;
}

const table: Record<OutputKind, Omit<ConfigurationColour, 'outputKind' | 'background'> & { to?: string }> = {
  shg: { hex: '#6d3fd1', falseColour: false, legend: 'SHG · visible, ~400 nm violet' },
  fundamental: { hex: '#a3243a', falseColour: true, legend: 'Fundamental · ~800 nm, false colour' },
  opa_signal: { hex: '#d08a12', falseColour: true, legend: 'OPA signal · 1.1–1.6 µm, false colour' },
  opa_idler: { hex: '#15877f', falseColour: true, legend: 'OPA idler · 1.6–2.6 µm, false colour' },
  dfg: { hex: '#7a37a0', to: '#b8307e', falseColour: true, legend: 'DFG mid-IR · 2.6–11 µm, false colour' },
};

const dfgRampStart = '#3f3fb8';

/** Colour for a configuration's output kind; matches the --color-spectral-* tokens in index.css. */
export function configurationColour(outputKind: OutputKind): ConfigurationColour {
  const entry = table[outputKind];
  const background =
    outputKind === 'dfg' ? `linear-gradient(90deg, ${dfgRampStart}, ${entry.to ?? entry.hex})` : entry.hex;
  return { outputKind, hex: entry.hex, background, falseColour: entry.falseColour, legend: entry.legend };
}
