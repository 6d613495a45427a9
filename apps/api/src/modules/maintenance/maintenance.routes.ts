import { maintenanceInputSchema, updateMaintenanceInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { maintenanceService } from './maintenance.service';

export function maintenanceRoutes(ctx: AppContext): RouteDef[] {
  const s = maintenanceService(ctx);
  return [
    {
      method: 'post', path: '/maintenance', access: ['staff'],
      handler: async (req, res) => { res.status(201).json(await s.create(currentUser(req), maintenanceInputSchema.parse(req.body), String(req.id))); },
    },
    {
      method: 'patch', path: '/maintenance/:id', access: ['staff'],
      handler: async (req, res) => { res.json(await s.update(currentUser(req), param(req, 'id'), updateMaintenanceInputSchema.parse(req.body), String(req.id))); },
    },
    {
      method: 'delete', path: '/maintenance/:id', access: ['staff'],
      handler: async (req, res) => { await s.remove(currentUser(req), param(req, 'id'), String(req.id)); res.status(204).end(); },
    },
  ];
}
