import type { TrainingRecordDto } from '@femtoslot/shared';
import { TableShell } from '../../../components/ui/table-shell';
import { HoldingStateCell, RevokeCell, RevokeHeader } from './holding-state-pill';

export function TrainingRecordsTable({ records, onRevoke }: { records: TrainingRecordDto[]; onRevoke?: (record: TrainingRecordDto) => void }) {
  return (
    <TableShell caption="Training records" testId="training-records" isEmpty={records.length === 0} empty="No training on record.">
      <thead className="bg-sunk text-xs uppercase tracking-wide text-ink-muted">
        <tr>
          <th className="px-4 py-2">Course</th>
          <th className="px-4 py-2">Completed</th>
          <th className="px-4 py-2">Expires</th>
          <th className="px-4 py-2">State</th>
          <th className="px-4 py-2">Recorded by</th>
          {onRevoke && <RevokeHeader />}
        </tr>
      </thead>
      <tbody>
        {records.map((r) => (
          <tr key={r.id} className="border-t border-line" data-testid="training-record-row" data-state={r.state}>
            <td className="px-4 py-2 font-semibold">{r.courseName}</td>
            <td className="px-4 py-2 tabular-nums">{r.completedOn}</td>
            <td className="px-4 py-2 tabular-nums">{r.expiresOn}</td>
            <HoldingStateCell holding={r} />
            <td className="px-4 py-2 text-ink-muted">{r.recordedByName ?? '—'}</td>
            {onRevoke && <RevokeCell state={r.state} onRevoke={() => onRevoke(r)} />}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
