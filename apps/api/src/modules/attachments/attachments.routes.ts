import multer from 'multer';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { AppError } from '../../lib/errors/app-error';
import { UsageLog } from '../usage/usage-log.entity';
import { attachmentsService, MAX_UPLOAD_BYTES, toAttachmentDto } from './attachments.service';
import { attachmentDisposition } from './content-disposition';

// preservePath: see the name as sent, so that one with path parts is refused rather than silently cut down.
// defParamCharset: browsers send the file name as raw UTF-8 (WHATWG HTML form encoding), not Latin-1.
const upload = multer({ storage: multer.memoryStorage(), preservePath: true, defParamCharset: 'utf8', limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5 } });

export function attachmentsRoutes(ctx: AppContext): RouteDef[] {
  const s = attachmentsService(ctx);
  const loggers = ['collaborator', 'member', 'pi', 'staff'] as const;
  return [
    {
      method: 'post', path: '/bookings/:id/attachments', access: loggers, scope: 'organisation', owner: 'booking', before: [upload.single('file')],
      handler: async (req, res) => { res.status(201).json({ attachment: toAttachmentDto(await s.upload(currentUser(req), param(req, 'id'), req.file)) }); },
    },
    {
      method: 'post', path: '/usage/:id/attachments', access: loggers, scope: 'organisation', owner: 'usage_log', before: [upload.single('file')],
      handler: async (req, res) => {
        const log = await ctx.db.getRepository(UsageLog).findOneBy({ id: param(req, 'id') });
        if (!log) throw new AppError('not_found', 'Session log was not found', 404);
        const a = await s.upload(currentUser(req), log.bookingId, req.file, { usageLogId: log.id });
        res.status(201).json({ attachment: toAttachmentDto(a) });
      },
    },
    {
      method: 'get', path: '/attachments/:id', access: 'signed_in', scope: 'organisation', owner: 'attachment',
      handler: async (req, res) => {
        const { attachment, filePath } = await s.forDownload(currentUser(req), param(req, 'id'));
        res.set('Content-Type', attachment.contentType);
        res.set('X-Content-Type-Options', 'nosniff');
        res.set('Content-Security-Policy', "default-src 'none'; sandbox");
        res.set('Content-Disposition', attachmentDisposition(attachment.originalName));
        res.sendFile(filePath);
      },
    },
  ];
}
