import { describeInstant, formatZonedInstant } from '@femtoslot/shared/time/format-instant';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../lib/cx';
import { formatMinutes, viewerTimeZone } from '../../../lib/wall-time';
import type { RequestVerdict } from '../lib/request-verdict';

function headline(verdict: RequestVerdict): string {
  switch (verdict.kind) {
    case 'maintenance':
      return 'Refused: the time overlaps a maintenance window.';
    case 'overlap':
      return 'Refused: the time overlaps another booking.';
    case 'changeover_short': {
      const { side, neighbour } = verdict.short!;
      const where = side === 'before' ? 'from the booking before' : 'into the booking after';
      return `Refused: the changeover ${where} needs ${formatMinutes(neighbour.neededMinutes)} but only ${formatMinutes(neighbour.availableMinutes)} are free (${formatMinutes(neighbour.shortfallMinutes)} short).`;
    }
    case 'rule':
      return 'Refused: the request breaks the rules listed below.';
    case 'fits':
      return 'Fits: no overlap, and the changeover fits on both sides.';
  }
}

export interface RequestVerdictLineProps {
  verdict: RequestVerdict;
  /** the facility's zone; the viewer's own is added when it differs */
  timeZone: string;
  onUseEarliest: (earliestStart: string) => void;
}

/** The one verdict of the live check, with the earliest start that works when the time itself is the problem. */
export function RequestVerdictLine({ verdict, timeZone, onUseEarliest }: RequestVerdictLineProps) {
  const timeIsTheProblem = verdict.kind === 'overlap' || verdict.kind === 'maintenance' || verdict.kind === 'changeover_short';
  const earliest = timeIsTheProblem ? verdict.earliestStart : null;
  return (
    <div className="space-y-1.5">
      <p
        data-testid="request-verdict"
        data-verdict={verdict.kind}
        role="status"
        className={cx('font-semibold', verdict.refuses ? 'text-danger' : 'text-success')}
      >
        {headline(verdict)}
      </p>
      {timeIsTheProblem && (
        <div data-testid="earliest-start" data-earliest-start={earliest ?? ''} className="flex flex-wrap items-center gap-2">
          {earliest ? (
            <>
              <span>The earliest start that works is {describeInstant(earliest, timeZone, viewerTimeZone())}.</span>
              <Button size="sm" variant="secondary" data-testid="use-earliest-start" onClick={() => onUseEarliest(earliest)}>
                Use {formatZonedInstant(earliest, timeZone).split(', ').pop()}
              </Button>
            </>
          ) : (
            <span>No later start within the booking horizon works.</span>
          )}
        </div>
      )}
    </div>
  );
}
