import { DEFAULT_PUMP_NM, isEngineError, tableBands, type OutputKind } from '@femtoslot/shared';
import type { MigrationInterface, QueryRunner } from 'typeorm';

interface Row { id: string; output_kind: OutputKind; min_nm: number; max_nm: number; required_od: number; pump_nm: number | null }

/** Every wavelength the configuration can put on the table over its tuning range, widened to whole nm. */
function tableSpan(r: Row): { minNm: number; maxNm: number } {
  try {
    const bands = tableBands({ outputKind: r.output_kind, minNm: r.min_nm, maxNm: r.max_nm, pumpNm: r.pump_nm ?? DEFAULT_PUMP_NM });
    return { minNm: Math.floor(Math.min(...bands.map((b) => b.minNm))), maxNm: Math.ceil(Math.max(...bands.map((b) => b.maxNm))) };
  } catch (error) {
    if (!isEngineError(error)) throw error;
    return { minNm: Math.floor(r.min_nm), maxNm: Math.ceil(r.max_nm) };
  }
}

/**
 * The required OD becomes a list of wavelength bands per configuration ({minNm, maxNm, od}), set by the laser-safety
 * officer. Each existing configuration keeps its old OD as one band over every wavelength its table can carry.
 */
export class RequiredOdBands1765700000000 implements MigrationInterface {
  name = 'RequiredOdBands1765700000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE configurations ADD COLUMN required_od_bands jsonb`);
    const rows: Row[] = await q.query(
      `SELECT c.id, c.output_kind, c.min_nm::float8 AS min_nm, c.max_nm::float8 AS max_nm, c.required_od::float8 AS required_od, i.pump_nm::float8 AS pump_nm
         FROM configurations c JOIN instruments i ON i.id = c.instrument_id`);
    for (const r of rows) {
      const span = tableSpan(r);
      await q.query(`UPDATE configurations SET required_od_bands = $2::jsonb WHERE id = $1`, [r.id, JSON.stringify([{ ...span, od: r.required_od }])]);
    }
    await q.query(`ALTER TABLE configurations ALTER COLUMN required_od_bands SET NOT NULL,
      ADD CONSTRAINT configurations_required_od_bands CHECK (jsonb_typeof(required_od_bands) = 'array' AND jsonb_array_length(required_od_bands) BETWEEN 1 AND 20)`);
    await q.query(`ALTER TABLE configurations DROP COLUMN required_od`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE configurations ADD COLUMN required_od numeric(4,1) CHECK (required_od >= 0 AND required_od <= 12)`);
    // The strictest band stands for the whole configuration: one figure cannot be lower anywhere than a band asked.
    await q.query(`UPDATE configurations c SET required_od = (SELECT max((b->>'od')::numeric) FROM jsonb_array_elements(c.required_od_bands) b)`);
    await q.query(`ALTER TABLE configurations ALTER COLUMN required_od SET NOT NULL`);
    await q.query(`ALTER TABLE configurations DROP COLUMN required_od_bands`);
  }
}
