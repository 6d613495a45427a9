import { useMemo, useState } from 'react';
import { isOutputKind } from '../../../components/ui/configuration-chip';
import { ConfigurationLegend } from '../../../components/ui/configuration-legend';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading, Spinner } from '../../../components/ui/spinner';
import { useConfigurations } from '../../../features/configurations/api/get-configurations';
import { useInstruments } from '../../../features/configurations/api/get-instruments';
import { useFacility } from '../../../features/facility/api/get-facility';
import { useTuningCoverage } from '../../../features/reports/api/get-tuning-coverage';
import { useUtilisation } from '../../../features/reports/api/get-utilisation';
import { HoursByReport } from '../../../features/reports/components/hours-by-report';
import { PulseTrendReport } from '../../../features/reports/components/pulse-trend-report';
import { TuningCoverageReport } from '../../../features/reports/components/tuning-coverage-report';
import { UtilisationReport } from '../../../features/reports/components/utilisation-report';
import { type ReportFilters, defaultReportFilters, pulseTrendCsvHref, reportQuery, tuningCoverageCsvHref, utilisationCsvHref } from '../../../features/reports/lib/report-query';
import { useSignedInUser } from '../../../lib/auth';
import { configurationColour } from '../../../lib/configuration-colour';
import { ReportFiltersBar } from './report-filters';

const neutral = 'var(--color-accent)';

export function ReportsPage() {
  const user = useSignedInUser();
  const facility = useFacility();
  if (facility.isPending) return <PageLoading label="Loading reports" />;
  if (facility.isError) return <Notice tone="danger" title="Reports could not be loaded">{facility.error.message}</Notice>;
  return <ReportsBody timeZone={facility.data.timeZone} ownGroupOnly={user.role === 'pi'} />;
}

function ReportsBody({ timeZone, ownGroupOnly }: { timeZone: string; ownGroupOnly: boolean }) {
  const [filters, setFilters] = useState<ReportFilters>(() => defaultReportFilters(timeZone));
  const query = useMemo(() => reportQuery(filters, timeZone), [filters, timeZone]);
  const instruments = useInstruments();
  const configurations = useConfigurations();
  const utilisation = useUtilisation(query);
  const coverage = useTuningCoverage(query);

  const byKey = useMemo(() => new Map((configurations.data ?? []).map((c) => [c.key, c])), [configurations.data]);
  const kindOf = (key: string) => byKey.get(key)?.outputKind ?? (isOutputKind(key) ? key : null);
  const colourFor = (key: string) => {
    const kind = kindOf(key);
    return kind ? configurationColour(kind).hex : neutral;
  };
  const legendFor = (key: string) => {
    const kind = kindOf(key);
    const name = byKey.get(key)?.name;
    return kind && name ? `${name}${configurationColour(kind).falseColour ? ' (false colour)' : ''}` : name;
  };
  const nameFor = (key: string) => byKey.get(key)?.name ?? key;
  const axis = query ? { fromMs: Date.parse(query.from), toMs: Date.parse(query.to), timeZone } : null;
  const fetching = utilisation.isFetching || coverage.isFetching;

  return (
    <div data-testid="reports-page">
      <PageHeader
        title="Reports"
        lead={
          ownGroupOnly
            ? "Your group's beam time: utilisation, tuning coverage and the pump's pulse duration."
            : 'Use of the source and the benches: utilisation, hours by configuration and organisation, tuning coverage and the pump pulse duration.'
        }
      />
      <div className="space-y-5">
        <ReportFiltersBar filters={filters} onChange={setFilters} instruments={instruments.data ?? []} timeZone={timeZone} invalid={query === null}>
          {fetching && (
            <span className="flex items-center gap-2 pb-2 text-xs text-ink-muted" role="status">
              <Spinner /> Updating…
            </span>
          )}
        </ReportFiltersBar>
        {query && axis && (
          <>
            {utilisation.isError && <Notice tone="danger" title="Utilisation could not be loaded">{utilisation.error.message}</Notice>}
            {utilisation.isPending && !utilisation.isError && <PageLoading label="Loading utilisation" />}
            {utilisation.data && (
              <>
                <UtilisationReport rows={utilisation.data.rows} groupBy={query.groupBy} csvHref={utilisationCsvHref(query)} />
                <div className="grid gap-5 lg:grid-cols-2">
                  <HoursByReport
                    title="Hours by configuration"
                    description="Logged beam time per configuration, in its spectral or false colour."
                    what="configuration"
                    rows={utilisation.data.byConfiguration}
                    colourFor={colourFor}
                    chartTestId="by-configuration-chart"
                    tableTestId="by-configuration-table"
                    csvHref={utilisationCsvHref(query)}
                  />
                  <HoursByReport
                    title="Hours by organisation"
                    description={ownGroupOnly ? 'Logged beam time of your group.' : 'Logged beam time per group and external organisation.'}
                    what="organisation"
                    rows={utilisation.data.byOrganisation}
                    colourFor={() => neutral}
                    chartTestId="by-organisation-chart"
                    tableTestId="by-organisation-table"
                    csvHref={utilisationCsvHref(query)}
                  />
                </div>
              </>
            )}
            {coverage.isError && <Notice tone="danger" title="Tuning coverage could not be loaded">{coverage.error.message}</Notice>}
            {coverage.isPending && !coverage.isError && <PageLoading label="Loading tuning coverage" />}
            {coverage.data && (
              <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_20rem]">
                <div className="min-w-0 space-y-5">
                  <TuningCoverageReport segments={coverage.data.segments} axis={axis} colourFor={colourFor} legendFor={legendFor} csvHref={tuningCoverageCsvHref(query)} />
                  <PulseTrendReport
                    trend={coverage.data.pulseTrend}
                    specFs={coverage.data.pumpPulseSpecFs}
                    axis={axis}
                    colourFor={colourFor}
                    nameFor={nameFor}
                    csvHref={pulseTrendCsvHref(query)}
                  />
                </div>
                <aside>
                  <ConfigurationLegend />
                </aside>
              </div>
            )}
          </>
        )}
      </div>
    </div>
  );
}
