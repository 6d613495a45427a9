import { type AuthorisationGap, type PersonTrainingDto, describeGaps } from '@femtoslot/shared';
import { StatusPill } from '../../../components/ui/status-pill';

/** Plain words for one gap, shared by the request form's safety step and this page. */
export const gapText = (gap: AuthorisationGap) => describeGaps([gap]);

/** Which configurations the person may use today, and what each of the others still needs. */
export function AuthorisationSummary({ authorisations }: { authorisations: PersonTrainingDto['authorisations'] }) {
  return (
    <ul className="divide-y divide-line overflow-hidden rounded-xl border border-line bg-panel" data-testid="authorisation-summary">
      {authorisations.map((a) => (
        <li key={a.configurationId} className="flex flex-wrap items-start justify-between gap-3 px-4 py-2.5 text-sm" data-testid="authorisation-row" data-ok={a.ok}>
          <div>
            <p className="font-semibold">{a.configurationName} <span className="font-normal text-ink-muted">· {a.instrumentName}</span></p>
            {!a.ok && (
              <ul className="mt-1 list-disc pl-5 text-ink-muted">
                {a.gaps.map((g) => <li key={`${g.kind}-${g.name}`}>{gapText(g)}</li>)}
              </ul>
            )}
          </div>
          {a.ok ? <StatusPill tone="success">Cleared today</StatusPill> : <StatusPill tone="caution">Needs {a.gaps.length}</StatusPill>}
        </li>
      ))}
    </ul>
  );
}
