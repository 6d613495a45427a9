import { confirmUsageInputSchema, usageLogInputSchema } from '@femtoslot/shared';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { usageService } from './usage.service';

export function usageRoutes(ctx: AppContext): RouteDef[] {
  const s = usageService(ctx);
  const loggers = ['collaborator', 'member', 'pi', 'staff'] as const;
  return [
    {
      method: 'get', path: '/usage/sessions', access: [...loggers, 'admin'], scope: 'organisation',
      handler: async (req, res) => {
        const { scope } = z.object({ scope: z.enum(['mine', 'to_confirm']).default('mine') }).parse(req.query);
        res.json({ sessions: await s.sessions(currentUser(req), scope) });
      },
    },
    { method: 'get', path: '/bookings/:id/usage', access: [...loggers, 'finance', 'admin'], scope: 'organisation', owner: 'booking', handler: async (req, res) => { res.json(await s.get(currentUser(req), param(req, 'id'))); } },
    {
      method: 'post', path: '/bookings/:id/usage', access: loggers, scope: 'organisation', owner: 'booking',
      handler: async (req, res) => { res.json({ log: await s.save(currentUser(req), param(req, 'id'), usageLogInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/usage/:id/confirm', access: ['staff'],
      handler: async (req, res) => { res.json({ log: await s.confirm(currentUser(req), param(req, 'id'), confirmUsageInputSchema.parse(req.body ?? {}), String(req.id)) }); },
    },
  ];
}
