import type { UsageLogDto } from '@femtoslot/shared';
import { toAttachmentDto } from '../attachments/attachments.service';
import type { Attachment } from '../attachments/attachment.entity';
import type { UsageLog } from './usage-log.entity';
import type { UsageSegment } from './usage-segment.entity';

export function toUsageLogDto(log: UsageLog, segments: UsageSegment[], attachments: Attachment[], keyOf: (configurationId: string) => string, nameOf: (userId: string) => string): UsageLogDto {
  return {
    id: log.id,
    bookingId: log.bookingId,
    status: log.status,
    actualStartsAt: log.actualStartsAt.toISOString(),
    actualEndsAt: log.actualEndsAt.toISOString(),
    outsideGrace: log.outsideGrace,
    notes: log.notes,
    segments: [...segments].sort((a, b) => a.startsAt.getTime() - b.startsAt.getTime()).map((s) => ({
      id: s.id, configurationId: s.configurationId, configurationKey: keyOf(s.configurationId), startsAt: s.startsAt.toISOString(), endsAt: s.endsAt.toISOString(),
      minNm: s.minNm, maxNm: s.maxNm, averagePowerMw: s.averagePowerMw, pulseFwhmFs: s.pulseFwhmFs, pulseShape: s.pulseShape, spectralFwhmNm: s.spectralFwhmNm, traceAttachmentId: s.traceAttachmentId, notes: s.notes,
    })),
    attachments: attachments.map(toAttachmentDto),
    submittedBy: nameOf(log.submittedBy),
    submittedAt: log.submittedAt.toISOString(),
    confirmedBy: log.confirmedBy ? nameOf(log.confirmedBy) : null,
    confirmedAt: log.confirmedAt?.toISOString() ?? null,
    billedBy: log.billedBy ? nameOf(log.billedBy) : null,
    billedAt: log.billedAt?.toISOString() ?? null,
  };
}
