import { ComingSoon } from '../../../components/ui/coming-soon';
import { ConfigurationLegend } from '../../../components/ui/configuration-legend';
import { LaserCaution } from '../../../components/ui/laser-caution';
import { PageHeader } from '../../../components/ui/page-header';

export function CalendarPage() {
  return (
    <>
      <PageHeader title="Calendar" lead="Beam time on the source and the benches, by configuration." />
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-5">
          <ComingSoon>
            <p>Beam-time calendar with changeover-aware requests is being built.</p>
            <p>
              It will show bookings by configuration, maintenance windows, and the changeover time needed between one
              booking and the next.
            </p>
          </ComingSoon>
          <LaserCaution />
        </div>
        <ConfigurationLegend />
      </div>
    </>
  );
}
