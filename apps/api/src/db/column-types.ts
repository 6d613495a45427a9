import type { ValueTransformer } from 'typeorm';

/** pg returns numeric as text; wavelengths and ODs are read back as numbers (never money). */
export const numericTransformer: ValueTransformer = {
  to: (v: number | null | undefined) => v,
  from: (v: string | null) => (v === null ? null : Number(v)),
};
