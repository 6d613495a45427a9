import { createHash, randomBytes } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { AttachmentDto } from '@femtoslot/shared';
import { fileTypeFromBuffer } from 'file-type';
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import { facilityWideRoles } from '../bookings/booking.dto';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { UsageLog } from '../usage/usage-log.entity';
import { logLockedError } from '../usage/log-lock';
import { Attachment, type AttachmentType } from './attachment.entity';

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
const binaryTypes = new Map<string, { type: AttachmentType; extensions: string[] }>([
  ['application/pdf', { type: 'application/pdf', extensions: ['.pdf'] }],
  ['image/png', { type: 'image/png', extensions: ['.png'] }],
  ['image/jpeg', { type: 'image/jpeg', extensions: ['.jpg', '.jpeg'] }],
]);
const textTypes: Record<string, AttachmentType> = { '.csv': 'text/csv', '.txt': 'text/plain' };

export const toAttachmentDto = (a: Attachment): AttachmentDto => ({
  id: a.id, originalName: a.originalName, contentType: a.contentType, sizeBytes: a.sizeBytes, createdAt: a.createdAt.toISOString(), url: `/api/attachments/${a.id}`,
});

/** A name for display only (files are stored under random names); path parts are refused outright. */
export function cleanName(name: string): string {
  if (/[/\\]|\.\./.test(name) || /[\u0000-\u001f\u007f]/.test(name)) throw new AppError('bad_filename', 'File names may not contain path separators, ".." or control characters', 400);
  const trimmed = name.trim();
  if (!trimmed || trimmed.length > 255) throw new AppError('bad_filename', 'Give the file a name of 1–255 characters', 400);
  return trimmed;
}

/**
 * The type is decided by the bytes, not by the name or the browser's claim: PDF, PNG and JPEG by their signatures
 * (file-type), CSV and TXT as valid UTF-8 without NUL bytes and only under those extensions. A name that promises
 * one type while the content is another is refused.
 */
export async function detectType(buffer: Buffer, name: string): Promise<AttachmentType> {
  const ext = path.extname(name).toLowerCase();
  const sniffed = await fileTypeFromBuffer(buffer);
  if (sniffed) {
    const known = binaryTypes.get(sniffed.mime);
    if (!known) throw new AppError('unsupported_type', `Files of type ${sniffed.mime} are not accepted; use CSV, TXT, PDF, PNG or JPEG`, 415);
    if (!known.extensions.includes(ext)) throw new AppError('unsupported_type', `The file's content is ${sniffed.mime} but its name says "${ext || 'no extension'}"`, 415);
    return known.type;
  }
  const textType = textTypes[ext];
  const isText = !buffer.includes(0) && Buffer.from(buffer.toString('utf8'), 'utf8').equals(buffer);
  if (!textType || !isText) {
    throw new AppError('unsupported_type', textType
      ? 'The file is not plain UTF-8 text'
      : `The file's content does not match its "${ext || 'missing'}" extension; accepted: CSV, TXT, PDF, PNG, JPEG`, 415);
  }
  return textType;
}

export function attachmentsService(ctx: AppContext) {
  const dir = path.join(ctx.env.DATA_DIR, 'uploads');
  mkdirSync(dir, { recursive: true });

  async function bookingFor(m: EntityManager, viewer: SessionUser, bookingId: string): Promise<TimelineBlock> {
    const b = await m.getRepository(TimelineBlock).findOneBy({ id: bookingId, kind: 'booking' });
    if (!b) throw notFound('Booking');
    if (b.organisationId !== viewer.organisationId && viewer.role !== 'staff') throw forbidden('Only the booking’s organisation and facility staff can attach files');
    return b;
  }

  /**
   * Stores an upload for a booking (and lists it on the session log when `usageLogId` is given). The booking's log is
   * locked first: once billed, it takes no more files (409 log_locked), and the close cannot bill it mid-upload.
   */
  async function upload(viewer: SessionUser, bookingId: string, file: { buffer: Buffer; originalname: string } | undefined, opts: { usageLogId?: string } = {}): Promise<Attachment> {
    if (!file) throw new AppError('validation_failed', 'Attach a file in the field "file"', 400);
    return ctx.db.transaction(async (m) => {
      const booking = await bookingFor(m, viewer, bookingId);
      const name = cleanName(file.originalname);
      const log = await m.getRepository(UsageLog).findOne({ where: { bookingId: booking.id }, lock: { mode: 'pessimistic_write' } });
      if (log?.status === 'billed') throw await logLockedError(m, log);
      const contentType = await detectType(file.buffer, name);
      const storedName = randomBytes(16).toString('hex');
      const saved = await m.getRepository(Attachment).save({
        bookingId: booking.id, organisationId: booking.organisationId!, originalName: name, storedName, contentType,
        sizeBytes: file.buffer.length, sha256: createHash('sha256').update(file.buffer).digest('hex'), uploadedBy: viewer.id,
      });
      if (opts.usageLogId && log?.id === opts.usageLogId) {
        await m.query(`UPDATE usage_logs SET attachment_ids = attachment_ids || to_jsonb($2::text) WHERE id = $1`, [log.id, saved.id]);
      }
      // Written last, inside the transaction: a failed write leaves no row behind.
      await writeFile(path.join(dir, storedName), file.buffer, { flag: 'wx', mode: 0o600 });
      return saved;
    });
  }

  async function forDownload(viewer: SessionUser, id: string): Promise<{ attachment: Attachment; filePath: string }> {
    const a = await ctx.db.getRepository(Attachment).findOneBy({ id });
    if (!a) throw notFound('Attachment');
    if (a.organisationId !== viewer.organisationId && !facilityWideRoles.has(viewer.role)) throw forbidden('This file belongs to another organisation');
    return { attachment: a, filePath: path.join(dir, a.storedName) };
  }

  /** A stored text attachment's content (a trace the server analyses itself). */
  const readText = async (a: Attachment): Promise<string> => (await readFile(path.join(dir, a.storedName))).toString('utf8');

  return { upload, forDownload, readText };
}
