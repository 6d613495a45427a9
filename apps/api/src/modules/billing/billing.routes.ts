import { billingCloseInputSchema, billingPeriodInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { billingService } from './billing.service';

export function billingRoutes(ctx: AppContext): RouteDef[] {
  const s = billingService(ctx);
  return [
    { method: 'get', path: '/billing/periods', access: ['finance', 'admin'], scope: 'facility', handler: async (_req, res) => { res.json({ periods: await s.listPeriods() }); } },
    {
      method: 'post', path: '/billing/periods', access: ['finance'], scope: 'facility',
      handler: async (req, res) => { res.json(await s.openPeriod(currentUser(req), billingPeriodInputSchema.parse(req.body).month)); },
    },
    { method: 'get', path: '/billing/periods/:id', access: ['finance', 'admin'], scope: 'facility', handler: async (req, res) => { res.json(await s.getPeriod(param(req, 'id'))); } },
    {
      method: 'post', path: '/billing/periods/:id/close', access: ['finance'], scope: 'facility',
      handler: async (req, res) => {
        const out = await s.requestClose(currentUser(req), param(req, 'id'), billingCloseInputSchema.parse(req.body ?? {}), String(req.id));
        res.status(out.started ? 202 : 200).json(out);
      },
    },
    { method: 'get', path: '/billing/jobs/:id', access: ['finance', 'admin'], scope: 'facility', handler: async (req, res) => { res.json({ job: await s.job(param(req, 'id')) }); } },
  ];
}
