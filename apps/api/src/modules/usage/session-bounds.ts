import { isEngineError, type UsageSegmentInput } from '@femtoslot/shared';
import { In, type EntityManager } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { AppError } from '../../lib/errors/app-error';
import { Attachment } from '../attachments/attachment.entity';
import { attachmentsService } from '../attachments/attachments.service';
import type { TimelineBlock } from '../bookings/timeline-block.entity';
import type { FacilitySettings } from '../facility/facility-settings.entity';
import { analyseTraceText, checkPulse } from '../optics/trace-analysis';

const MIN = 60_000;

/** Where actual times may lie: the booking widened by the facility's window on each side. */
export function usageWindow(b: TimelineBlock, facility: FacilitySettings) {
  const minutes = facility.usageWindowMinutes;
  return {
    windowMinutes: minutes,
    earliestStartsAt: new Date(b.startsAt.getTime() - minutes * MIN).toISOString(),
    latestEndsAt: new Date(b.endsAt.getTime() + minutes * MIN).toISOString(),
  };
}

/** Refuses actual times outside the window (billing prices them, so they must stay near the booking). */
export function assertInsideWindow(b: TimelineBlock, facility: FacilitySettings, start: number, end: number): void {
  const w = usageWindow(b, facility);
  if (start < Date.parse(w.earliestStartsAt) || end > Date.parse(w.latestEndsAt)) {
    throw new AppError('outside_booking_window', `Actual times must lie within ${w.windowMinutes} min of the booking: from ${w.earliestStartsAt} to ${w.latestEndsAt}`, 422, w);
  }
}

/** More than the facility's grace from the booked start or end: staff are asked to look. */
export function isOutsideGrace(b: TimelineBlock, facility: FacilitySettings, start: number, end: number): boolean {
  const grace = (facility.policies.usageGraceMinutes ?? 30) * MIN;
  return Math.abs(start - b.startsAt.getTime()) > grace || Math.abs(end - b.endsAt.getTime()) > grace;
}

/** An engine refusal about one segment, with the segment's index added to its details. */
async function forSegment<T>(index: number, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (!isEngineError(error)) throw error;
    throw new AppError(error.code, `Segment ${index + 1}: ${error.message}`, 422, { ...error.details, segment: index });
  }
}

const round2 = (x: number) => Math.round(x * 100) / 100;

/**
 * The pulse FWHM each segment keeps. With a trace, the server reads the stored file and its figure replaces the
 * browser's; every pulse, typed or computed, is refused below one optical cycle and, with a spectral FWHM, below the
 * transform limit. The segment's shortest wavelength is taken as the centre (the most lenient of its range), and a
 * typed pulse without a shape is checked as sech², whose time-bandwidth product is the smaller.
 */
export async function verifiedPulses(ctx: AppContext, m: EntityManager, bookingId: string, segments: UsageSegmentInput[]): Promise<Array<number | null>> {
  const traceIds = segments.map((s) => s.traceAttachmentId).filter((x): x is string => !!x);
  const traces = new Map((traceIds.length ? await m.getRepository(Attachment).findBy({ id: In(traceIds), bookingId }) : []).map((a) => [a.id, a]));
  const files = attachmentsService(ctx);
  const out: Array<number | null> = [];
  for (const [i, s] of segments.entries()) {
    let pulse = s.pulseFwhmFs ?? null;
    if (s.traceAttachmentId) {
      const shape = s.pulseShape;
      if (!shape) throw new AppError('rule_violation', `Segment ${i + 1}: say which pulse shape (Gaussian or sech²) the trace is read with`, 422, { segment: i });
      const trace = traces.get(s.traceAttachmentId);
      if (!trace || !['text/csv', 'text/plain'].includes(trace.contentType)) {
        throw new AppError('rule_violation', `Segment ${i + 1}: the trace must be a CSV or TXT file uploaded to this booking`, 422, { segment: i });
      }
      const text = await files.readText(trace);
      pulse = round2((await forSegment(i, () => analyseTraceText(text, shape))).pulseFwhmFs);
    }
    if (pulse !== null) {
      const value = pulse;
      await forSegment(i, () => checkPulse(ctx, value, s.pulseShape ?? 'sech2', { centreNm: s.minNm, spectralFwhmNm: s.spectralFwhmNm ?? null }));
    }
    out.push(pulse);
  }
  return out;
}
