import type { ValueTransformer } from 'typeorm';

/** bigint money columns: pg returns them as text; read back as a number, refusing anything past 2^53. */
export const minorUnitsColumn: ValueTransformer = {
  to: (v: number | null | undefined) => v,
  from: (v: string | null) => {
    if (v === null) return null;
    const n = Number(v);
    if (!Number.isSafeInteger(n)) throw new Error(`Amount ${v} is outside the safe integer range`);
    return n;
  },
};
