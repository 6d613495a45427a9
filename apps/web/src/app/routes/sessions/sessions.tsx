import { useSearchParams } from 'react-router-dom';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/spinner';
import { useConfigurations } from '../../../features/configurations/api/get-configurations';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useSessions } from '../../../features/usage-logs/api/get-sessions';
import { SessionsTable } from '../../../features/usage-logs/components/sessions-table';
import { useSignedInUser } from '../../../lib/auth';
import { cx } from '../../../lib/cx';

type Tab = 'mine' | 'to_confirm';

function TabButton({ selected, onSelect, children, testId, count }: { selected: boolean; onSelect: () => void; children: string; testId: string; count?: number }) {
  return (
    <button
      type="button"
      role="tab"
      aria-selected={selected}
      data-testid={testId}
      onClick={onSelect}
      className={cx('-mb-px border-b-2 px-3 py-2 text-sm font-semibold', selected ? 'border-accent text-ink' : 'border-transparent text-ink-muted hover:text-ink')}
    >
      {children}
      {count !== undefined && count > 0 && <span className="ml-1.5 rounded-full bg-accent px-1.5 py-0.5 text-xs text-accent-ink">{count}</span>}
    </button>
  );
}

export function SessionsPage() {
  const user = useSignedInUser();
  const isStaff = user.role === 'staff';
  const [params, setParams] = useSearchParams();
  const tab: Tab = isStaff && params.get('tab') === 'to-confirm' ? 'to_confirm' : 'mine';
  const facility = useFacility();
  const configurations = useConfigurations();
  const mine = useSessions('mine', tab === 'mine');
  const toConfirm = useSessions('to_confirm', isStaff);
  const sessions = tab === 'mine' ? mine : toConfirm;

  const byId = new Map((configurations.data ?? []).map((c) => [c.id, c]));
  const configurationFor = (id: string) => byId.get(id);

  return (
    <>
      <PageHeader
        title="Session log"
        lead="What was actually tuned and measured in each session: times, configurations, tuning range, average power and pulse duration. Staff confirm each log before it is billed."
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0 space-y-4">
          {isStaff && (
            <div role="tablist" aria-label="Which sessions" className="flex gap-1 border-b border-line">
              <TabButton testId="all-sessions-tab" selected={tab === 'mine'} onSelect={() => setParams({})}>
                All sessions
              </TabButton>
              <TabButton testId="to-confirm-tab" selected={tab === 'to_confirm'} onSelect={() => setParams({ tab: 'to-confirm' })} count={toConfirm.data?.length}>
                To confirm
              </TabButton>
            </div>
          )}
          {facility.isPending || sessions.isPending ? (
            <PageLoading label="Loading sessions" />
          ) : facility.isError || sessions.isError ? (
            <Notice tone="danger" title="Sessions could not be loaded">
              {(facility.error ?? sessions.error)?.message}
            </Notice>
          ) : (
            <SessionsTable
              key={tab}
              sessions={sessions.data}
              timeZone={facility.data.timeZone}
              configurationFor={configurationFor}
              scope={tab}
              showWho={isStaff || user.role === 'pi'}
            />
          )}
          {facility.data && <p className="text-xs text-ink-muted">Times are wall-clock time in {facility.data.timeZone} (facility time).</p>}
        </div>
        <aside className="space-y-4">
          <LaserCaution />
          <p className="text-sm text-ink-muted">
            Log what was on the table: every configuration used, the tuning range each one covered, and the measured pulse duration. An autocorrelation
            trace can be dropped in to compute it.
          </p>
        </aside>
      </div>
    </>
  );
}
