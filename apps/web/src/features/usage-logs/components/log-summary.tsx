import type { UsageLogDto } from '@femtoslot/shared';
import { ConfigurationChip } from '../../../components/ui/configuration-chip';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import { rangeText } from '../lib/range-units';

export type ConfigurationLookup = (configurationId: string) => { name: string; outputKind: string } | undefined;

const number = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

/** A submitted log at a glance, for the staff who confirm it. */
export function LogSummary({ log, timeZone, configurationFor }: { log: UsageLogDto; timeZone: string; configurationFor: ConfigurationLookup }) {
  return (
    <div className="space-y-3 text-sm" data-testid="log-summary">
      <p>
        <span className="font-semibold">Actual: </span>
        {formatInstant(log.actualStartsAt, timeZone)} – {formatInstant(log.actualEndsAt, timeZone)} ({formatMinutes(minutesBetween(log.actualStartsAt, log.actualEndsAt))}), logged by{' '}
        {log.submittedBy}
      </p>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Segments of the log</caption>
        <thead className="text-xs text-ink-muted uppercase">
          <tr>
            <th scope="col" className="py-1 pr-3 font-semibold">Configuration</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Tuning range</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Time</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Average power</th>
            <th scope="col" className="py-1 font-semibold">Pulse duration</th>
          </tr>
        </thead>
        <tbody>
          {log.segments.map((s) => {
            const configuration = configurationFor(s.configurationId);
            return (
              <tr key={s.id} className="border-t border-line">
                <td className="py-1.5 pr-3">
                  <ConfigurationChip name={configuration?.name ?? s.configurationKey} outputKind={configuration?.outputKind ?? s.configurationKey} />
                </td>
                <td className="py-1.5 pr-3">{rangeText(s)}</td>
                <td className="py-1.5 pr-3">{formatMinutes(minutesBetween(s.startsAt, s.endsAt))}</td>
                <td className="py-1.5 pr-3">{s.averagePowerMw === null ? '—' : `${number.format(s.averagePowerMw)} mW`}</td>
                <td className="py-1.5">
                  {s.pulseFwhmFs === null ? '—' : `${number.format(s.pulseFwhmFs)} fs`}
                  {s.traceAttachmentId && <span className="text-ink-muted"> (from trace{s.pulseShape === 'sech2' ? ', sech²' : s.pulseShape ? ', Gaussian' : ''})</span>}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {log.notes && <p className="whitespace-pre-line text-ink-muted">{log.notes}</p>}
      {log.attachments.length > 0 && (
        <ul className="flex flex-wrap gap-x-4 gap-y-1">
          {log.attachments.map((a) => (
            <li key={a.id}>
              <a href={a.url} download={a.originalName} data-testid="attachment-link" className="font-semibold text-accent underline">
                {a.originalName}
              </a>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
