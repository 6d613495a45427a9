import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { TableShell } from '../../../components/ui/table-shell';
import { formatInstant, formatMinutes } from '../../../lib/wall-time';
import { useApplyDayPlan } from '../api/apply-day-plan';
import { type DayPlanProposal, useProposeDayPlan } from '../api/propose-day-plan';

export interface PlannedBookingInfo {
  label: string;
  currentStart: string;
}

export interface PlanDayPanelProps {
  instruments: { id: string; name: string }[];
  instrumentId: string;
  date: string;
  onInstrumentChange: (id: string) => void;
  onDateChange: (date: string) => void;
  timeZone: string;
  /** booking id → what the table shows about it now; composed by the page from the calendar */
  describe: (bookingId: string) => PlannedBookingInfo | undefined;
}

const reasonText: Record<string, string> = {
  window_too_short: 'its allowed window is shorter than the booking',
  no_room: 'no room is left on the day',
  crowded_out: 'placing it would push out others',
};

function movesAny(plan: DayPlanProposal, describe: PlanDayPanelProps['describe']): boolean {
  return plan.order.some((row) => {
    const info = describe(row.bookingId);
    return !info || new Date(info.currentStart).getTime() !== new Date(row.startsAt).getTime();
  });
}

/** Staff: reorder the day's movable requests to spend less time retuning, then apply. */
export function PlanDayPanel(props: PlanDayPanelProps) {
  const { instrumentId, date, timeZone } = props;
  const [flexMinutes, setFlexMinutes] = useState('120');
  const propose = useProposeDayPlan();
  const apply = useApplyDayPlan();
  const plan: DayPlanProposal | undefined = propose.data;

  const run = () => propose.mutate({ instrumentId, date, flexMinutes: Number(flexMinutes) || 0 });
  const applyPlan = () =>
    plan &&
    apply.mutate(
      { instrumentId, date, order: plan.order.map(({ bookingId, startsAt, endsAt }) => ({ bookingId, startsAt, endsAt })) },
      {
        onSuccess: (bookings) => {
          toast.success(`Plan applied · ${bookings.length} booking${bookings.length === 1 ? '' : 's'} placed`);
          propose.reset();
        },
      },
    );

  return (
    <div className="space-y-5" data-testid="plan-day">
      <div className="flex flex-wrap items-end gap-3 rounded-xl border border-line bg-panel px-4 py-3.5">
        <div className="w-56">
          <SelectField label="Instrument" value={instrumentId} onChange={(e) => (props.onInstrumentChange(e.target.value), propose.reset())}>
            {props.instruments.map((i) => (
              <option key={i.id} value={i.id}>
                {i.name}
              </option>
            ))}
          </SelectField>
        </div>
        <div className="w-44">
          <TextField label={`Day (${timeZone})`} type="date" name="date" value={date} onChange={(e) => (props.onDateChange(e.target.value), propose.reset())} />
        </div>
        <div className="w-52">
          <TextField label="Each may move (± min)" type="number" min={0} step={15} name="flexMinutes" value={flexMinutes} onChange={(e) => setFlexMinutes(e.target.value)} />
        </div>
        <Button data-testid="plan-run" busy={propose.isPending} onClick={run}>
          Propose an order
        </Button>
      </div>

      {propose.error && <Notice tone="danger" title="No proposal">{propose.error.message}</Notice>}
      {apply.error && <Notice tone="danger" title="The plan was not applied">{apply.error.message}</Notice>}

      {plan && (
        <>
          <div className="grid gap-3 sm:grid-cols-3">
            <div className="rounded-xl border border-line bg-panel px-4 py-3" data-testid="plan-proven" data-proven={plan.provenOptimal}>
              <p className="text-xs font-bold tracking-wide text-ink-muted uppercase">Method</p>
              <p className="mt-1 font-semibold">{plan.provenOptimal ? 'Proven optimal' : 'Heuristic — not proven'}</p>
              <p className="text-xs text-ink-muted">{plan.method === 'exact' ? 'Exact search over every order' : 'Local search; a better order may exist'}</p>
            </div>
            <div className="rounded-xl border border-line bg-panel px-4 py-3" data-testid="plan-changeover" data-minutes={plan.changeoverMinutes}>
              <p className="text-xs font-bold tracking-wide text-ink-muted uppercase">Changeover in the day</p>
              <p className="mt-1 font-semibold">⟳ {formatMinutes(plan.changeoverMinutes)}</p>
              <p className="text-xs text-ink-muted">
                As it stands: {formatMinutes(plan.currentChangeoverMinutes ?? plan.changeoverMinutes)} · first-come order: {formatMinutes(plan.firstComeChangeoverMinutes)}
              </p>
            </div>
            <div className="rounded-xl border border-line bg-panel px-4 py-3" data-testid="plan-saved" data-minutes={plan.savedMinutes}>
              <p className="text-xs font-bold tracking-wide text-ink-muted uppercase">Saved against the day as it stands</p>
              <p className="mt-1 font-semibold">{formatMinutes(plan.savedMinutes)}</p>
              {plan.savedMinutes === 0 && <p className="text-xs text-ink-muted">No order saves changeover; nothing would move.</p>}
              {plan.savedMinutes < 0 && <p className="text-xs text-ink-muted">More changeover, but more requests fit in.</p>}
            </div>
          </div>

          <TableShell caption="Proposed order against the current one" testId="plan-table" isEmpty={plan.order.length === 0} empty="Nothing on this day can be reordered.">
            <thead className="border-b border-line bg-sunk text-xs tracking-wide text-ink-muted uppercase">
              <tr>
                <th className="px-4 py-2">#</th>
                <th className="px-4 py-2">Booking</th>
                <th className="px-4 py-2">Current start</th>
                <th className="px-4 py-2">Proposed start</th>
                <th className="px-4 py-2">Changeover before</th>
              </tr>
            </thead>
            <tbody>
              {plan.order.map((row, index) => {
                const info = props.describe(row.bookingId);
                const moved = info && new Date(info.currentStart).getTime() !== new Date(row.startsAt).getTime();
                return (
                  <tr key={row.bookingId} className="border-b border-line last:border-0" data-testid="plan-row" data-booking-id={row.bookingId}>
                    <td className="px-4 py-2 tabular-nums">{index + 1}</td>
                    <td className="px-4 py-2 font-medium">{info?.label ?? row.bookingId.slice(0, 8)}</td>
                    <td className="px-4 py-2 tabular-nums text-ink-muted">{info ? formatInstant(info.currentStart, timeZone) : '—'}</td>
                    <td className={`px-4 py-2 tabular-nums ${moved ? 'font-semibold' : ''}`}>{formatInstant(row.startsAt, timeZone)}</td>
                    <td className="px-4 py-2 tabular-nums">⟳ {row.changeoverBeforeMinutes} min</td>
                  </tr>
                );
              })}
            </tbody>
          </TableShell>

          {plan.unplaced.length > 0 && (
            <div className="rounded-xl border border-line bg-panel px-4 py-3.5" data-testid="plan-unplaced">
              <p className="text-sm font-semibold">Requests the plan could not place</p>
              <ul className="mt-1.5 list-disc space-y-1 pl-5 text-sm text-ink-muted">
                {plan.unplaced.map((u) => (
                  <li key={u.bookingId}>
                    {props.describe(u.bookingId)?.label ?? u.bookingId.slice(0, 8)}: {reasonText[u.reason] ?? u.reason}
                  </li>
                ))}
              </ul>
            </div>
          )}

          <div className="flex justify-end">
            <Button data-testid="plan-apply" busy={apply.isPending} disabled={plan.order.length === 0 || !movesAny(plan, props.describe)} onClick={applyPlan}>
              Apply plan
            </Button>
          </div>
        </>
      )}
    </div>
  );
}
