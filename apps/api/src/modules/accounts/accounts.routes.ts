import { localDate } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Account } from './account.entity';
import { param } from '../../lib/auth/routes';
import { accountSetup, poUpload } from '../billing/account-setup';

export function accountsRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      // The caller's organisation's accounts, each saying whether a booking may be charged to it today and why not.
      method: 'get', path: '/accounts', access: 'signed_in', scope: 'organisation',
      handler: async (req, res) => {
        const user = currentUser(req);
        const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
        const today = localDate(new Date(), facility.timeZone);
        const rows = await ctx.db.getRepository(Account).find({ where: { organisationId: user.organisationId }, order: { name: 'ASC' } });
        res.json({
          accounts: rows.map((a) => {
            const reason = a.status === 'pending' ? 'Waiting for approval by a PI' : a.status === 'inactive' ? 'Inactive'
              : a.kind === 'external' && a.poExpiresOn && a.poExpiresOn < today ? `PO ${a.poNumber ?? ''} expired on ${a.poExpiresOn}` : null;
            return { id: a.id, name: a.name, kind: a.kind, status: a.status, poNumber: a.poNumber, poExpiresOn: a.poExpiresOn, costCentreCode: a.costCentreCode, usable: reason === null, reason };
          }),
        });
      },
    },
    // Billing (issue 6): account requests with an optional PO file (multipart), approved by a PI of the organisation.
    ...accountRequestRoutes(ctx),
  ];
}

function accountRequestRoutes(ctx: AppContext): RouteDef[] {
  const setup = accountSetup(ctx);
  return [
    {
      method: 'post', path: '/accounts', access: ['pi', 'collaborator', 'staff', 'finance'], scope: 'organisation', before: [poUpload.single('poFile')],
      handler: async (req, res) => { res.status(201).json({ account: await setup.create(currentUser(req), req.body, req.file, String(req.id)) }); },
    },
    {
      method: 'post', path: '/accounts/:id/approve', access: ['pi', 'staff'], scope: 'organisation', owner: 'account',
      handler: async (req, res) => { res.json({ account: await setup.approve(currentUser(req), param(req, 'id'), String(req.id)) }); },
    },
  ];
}
