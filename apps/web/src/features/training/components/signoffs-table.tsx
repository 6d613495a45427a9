import type { SignoffDto } from '@femtoslot/shared';
import { TableShell } from '../../../components/ui/table-shell';
import { HoldingStateCell, RevokeCell, RevokeHeader } from './holding-state-pill';

export function SignoffsTable({ signoffs, onRevoke }: { signoffs: SignoffDto[]; onRevoke?: (signoff: SignoffDto) => void }) {
  return (
    <TableShell caption="Configuration sign-offs" testId="signoffs" isEmpty={signoffs.length === 0} empty="No configuration sign-offs.">
      <thead className="bg-sunk text-xs uppercase tracking-wide text-ink-muted">
        <tr>
          <th className="px-4 py-2">Configuration</th>
          <th className="px-4 py-2">From</th>
          <th className="px-4 py-2">Until</th>
          <th className="px-4 py-2">State</th>
          <th className="px-4 py-2">Granted by</th>
          {onRevoke && <RevokeHeader />}
        </tr>
      </thead>
      <tbody>
        {signoffs.map((s) => (
          <tr key={s.id} className="border-t border-line" data-testid="signoff-row" data-state={s.state}>
            <td className="px-4 py-2">
              <span className="font-semibold">{s.configurationName}</span> <span className="text-ink-muted">· {s.instrumentName}</span>
              {s.note && <p className="text-xs text-ink-muted">{s.note}</p>}
            </td>
            <td className="px-4 py-2 tabular-nums">{s.grantedOn}</td>
            <td className="px-4 py-2 tabular-nums">{s.expiresOn ?? 'No expiry'}</td>
            <HoldingStateCell holding={s} />
            <td className="px-4 py-2 text-ink-muted">{s.grantedByName}</td>
            {onRevoke && <RevokeCell state={s.state} onRevoke={() => onRevoke(s)} />}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
