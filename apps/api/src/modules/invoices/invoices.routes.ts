import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { renderInvoicePdf } from './invoice-pdf';
import { invoicesService } from './invoices.service';

const viewers = ['finance', 'admin', 'pi', 'collaborator'] as const;

export function invoicesRoutes(ctx: AppContext): RouteDef[] {
  const s = invoicesService(ctx);
  return [
    { method: 'get', path: '/invoices', access: viewers, scope: 'organisation', handler: async (req, res) => { res.json({ invoices: await s.list(currentUser(req)) }); } },
    {
      method: 'get', path: '/invoices/export.csv', access: viewers, scope: 'organisation',
      handler: async (req, res) => {
        res.type('text/csv; charset=utf-8').attachment('femtoslot-invoices.csv').send(await s.invoicesCsv(currentUser(req)));
      },
    },
    {
      method: 'get', path: '/journals/export.csv', access: ['finance', 'admin'], scope: 'facility',
      handler: async (_req, res) => { res.type('text/csv; charset=utf-8').attachment('femtoslot-journals.csv').send(await s.journalsCsv()); },
    },
    {
      method: 'get', path: '/invoices/:id.pdf', access: viewers, scope: 'organisation', owner: 'invoice',
      handler: async (req, res) => {
        const inv = await s.one(currentUser(req), param(req, 'id'));
        const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
        res.type('application/pdf').attachment(`${inv.number}.pdf`).send(await renderInvoicePdf(inv, { name: facility.name, timeZone: facility.timeZone }));
      },
    },
    { method: 'get', path: '/invoices/:id', access: viewers, scope: 'organisation', owner: 'invoice', handler: async (req, res) => { res.json({ invoice: await s.one(currentUser(req), param(req, 'id')) }); } },
  ];
}
