import { changeoverPairsInputSchema, type InstrumentAdminDto } from '@femtoslot/shared';
import { useState } from 'react';
import type { InstrumentChange } from '../api/save-instrument-change';
import { ReviewAndSave } from './review-and-save';

type Cells = Record<string, string>;
const cellKey = (from: string, to: string) => `${from}>${to}`;

function cellsOf(instrument: InstrumentAdminDto): Cells {
  const cells: Cells = {};
  for (const p of instrument.changeoverPairs) cells[cellKey(p.fromConfigurationId, p.toConfigurationId)] = String(p.baseMinutes);
  return cells;
}

/**
 * Base minutes from one configuration (row) to another (column). A blank cell uses the reverse pair if it is set,
 * else the instrument's default changeover; retuning within one configuration uses minutes per nm instead.
 */
export function ChangeoverMatrix({ instrument, timeZone }: { instrument: InstrumentAdminDto; timeZone: string }) {
  const [cells, setCells] = useState<Cells>(() => cellsOf(instrument));
  const configs = instrument.configurations;
  const pairs = Object.entries(cells)
    .filter(([, v]) => v.trim() !== '')
    .map(([k, v]) => {
      const [fromConfigurationId, toConfigurationId] = k.split('>') as [string, string];
      return { fromConfigurationId, toConfigurationId, baseMinutes: Number(v) };
    });
  const parsed = changeoverPairsInputSchema.safeParse({ pairs });
  const change: InstrumentChange | null = parsed.success ? { kind: 'changeover-pairs', id: instrument.id, input: parsed.data } : null;
  if (configs.length < 2) return <p className="text-sm text-ink-muted">Add at least two configurations to set changeover minutes between them.</p>;
  return (
    <div className="space-y-2" data-testid="changeover-matrix">
      <div className="overflow-x-auto rounded-lg border border-line">
        <table className="text-sm">
          <caption className="sr-only">Base changeover minutes, from the row’s configuration to the column’s</caption>
          <thead className="bg-sunk text-xs text-ink-muted">
            <tr>
              <th className="px-2 py-1.5 text-left">from ↓ to →</th>
              {configs.map((c) => (
                <th key={c.id} scope="col" className="px-2 py-1.5 text-left font-semibold">
                  {c.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {configs.map((from) => (
              <tr key={from.id} className="border-t border-line">
                <th scope="row" className="px-2 py-1 text-left font-semibold whitespace-nowrap">
                  {from.name}
                </th>
                {configs.map((to) => {
                  const k = cellKey(from.id, to.id);
                  if (from.id === to.id) {
                    return (
                      <td key={k} className="px-2 py-1 text-xs text-ink-muted">
                        retune
                      </td>
                    );
                  }
                  const value = cells[k] ?? '';
                  const bad = value.trim() !== '' && !(Number.isInteger(Number(value)) && Number(value) >= 0 && Number(value) <= 1440);
                  return (
                    <td key={k} className="px-1 py-1">
                      <input
                        type="number"
                        min={0}
                        max={1440}
                        step={1}
                        aria-label={`Minutes from ${from.name} to ${to.name}`}
                        aria-invalid={bad || undefined}
                        placeholder={cells[cellKey(to.id, from.id)] || String(instrument.defaultChangeoverMinutes)}
                        value={value}
                        onChange={(e) => setCells({ ...cells, [k]: e.target.value })}
                        className={`w-16 rounded border bg-panel px-1.5 py-0.5 tabular-nums ${bad ? 'border-danger' : 'border-line'}`}
                      />
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-muted">
        Greyed figures show what a blank cell uses: the reverse pair or the default of {instrument.defaultChangeoverMinutes} min. A pulse check and any
        warm-up are added on top. Minutes are whole numbers, 0–1440.
      </p>
      <ReviewAndSave change={change} timeZone={timeZone} label="Save changeover minutes" />
    </div>
  );
}
