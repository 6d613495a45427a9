import { createHash, randomBytes } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { createAccountInputSchema } from '@femtoslot/shared';
import { fileTypeFromBuffer } from 'file-type';
import multer from 'multer';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import { Account } from '../accounts/account.entity';
import { recordAudit } from '../audit/audit.service';
import { cleanName } from '../attachments/attachments.service';
import { Organisation } from '../organisations/organisation.entity';
import { AccountBillingDetails } from './billing.entities';

export const poUpload = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: 10 * 1024 * 1024, files: 1, fields: 12 } });

const anyOrganisation = new Set(['staff', 'finance']);

/** Account requests (POST /api/accounts) and their approval by a PI of the organisation. */
export function accountSetup(ctx: AppContext) {
  const dir = path.join(ctx.env.DATA_DIR, 'purchase-orders');
  mkdirSync(dir, { recursive: true });

  async function create(viewer: SessionUser, body: unknown, file: { buffer: Buffer; originalname: string } | undefined, requestId?: string) {
    const input = createAccountInputSchema.parse(body);
    const organisationId = input.organisationId ?? viewer.organisationId;
    if (organisationId !== viewer.organisationId && !anyOrganisation.has(viewer.role)) throw forbidden('You can request accounts for your own organisation only');
    const organisation = await ctx.db.getRepository(Organisation).findOneBy({ id: organisationId });
    if (!organisation) throw notFound('Organisation');
    if ((input.kind === 'cost_centre') !== (organisation.kind === 'internal')) {
      throw new AppError('rule_violation', input.kind === 'cost_centre' ? 'Cost-centre accounts are for internal groups' : 'External accounts are for external organisations', 422);
    }
    let po: { original: string; stored: string; sha256: string; size: number } | null = null;
    if (file) {
      if (input.kind !== 'external') throw new AppError('validation_failed', 'A PO file belongs to an external account', 400);
      const original = cleanName(file.originalname);
      const sniffed = await fileTypeFromBuffer(file.buffer);
      if (sniffed?.mime !== 'application/pdf') throw new AppError('unsupported_type', 'The PO file must be a PDF (judged by its content)', 415);
      const stored = randomBytes(16).toString('hex');
      await writeFile(path.join(dir, stored), file.buffer, { flag: 'wx', mode: 0o600 });
      po = { original, stored, sha256: createHash('sha256').update(file.buffer).digest('hex'), size: file.buffer.length };
    }
    return ctx.db.transaction(async (m) => {
      const account = await m.getRepository(Account).save(m.getRepository(Account).create({
        organisationId, kind: input.kind, name: input.name, status: 'pending',
        costCentreCode: input.kind === 'cost_centre' ? input.costCentreCode : null,
        billingContactEmail: input.kind === 'external' ? input.billingContactEmail : null,
        poNumber: input.kind === 'external' ? input.poNumber : null,
        poExpiresOn: input.kind === 'external' ? input.poExpiresOn ?? null : null,
      }));
      const taxId = input.kind === 'external' ? input.taxId ?? null : null;
      if (taxId || po) {
        await m.getRepository(AccountBillingDetails).insert({
          accountId: account.id, taxId, poFileOriginalName: po?.original ?? null, poFileStoredName: po?.stored ?? null, poFileSha256: po?.sha256 ?? null, poFileSizeBytes: po?.size ?? null, createdBy: viewer.id,
        });
      }
      await recordAudit(m, { actorUserId: viewer.id, action: 'account.requested', entityType: 'account', entityId: account.id, after: { kind: account.kind, name: account.name, organisationId }, requestId });
      return { ...dto(account), taxId, poFile: po ? { name: po.original, sizeBytes: po.size } : null };
    });
  }

  async function approve(viewer: SessionUser, id: string, requestId?: string) {
    return ctx.db.transaction(async (m) => {
      const account = await m.getRepository(Account).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!account) throw notFound('Account');
      const allowed = viewer.role === 'staff' || (viewer.role === 'pi' && viewer.organisationId === account.organisationId);
      if (!allowed) throw forbidden('Only a PI of the account’s organisation (or facility staff) can approve it');
      if (account.status !== 'pending') throw new AppError('conflict', `The account is already ${account.status}`, 409);
      Object.assign(account, { status: 'approved', approvedBy: viewer.id, approvedAt: new Date() });
      await m.getRepository(Account).save(account);
      await recordAudit(m, { actorUserId: viewer.id, action: 'account.approved', entityType: 'account', entityId: account.id, requestId });
      return dto(account);
    });
  }

  return { create, approve };
}

const dto = (a: Account) => ({
  id: a.id, organisationId: a.organisationId, kind: a.kind, name: a.name, status: a.status, costCentreCode: a.costCentreCode,
  billingContactEmail: a.billingContactEmail, poNumber: a.poNumber, poExpiresOn: a.poExpiresOn, approvedAt: a.approvedAt?.toISOString() ?? null,
});
