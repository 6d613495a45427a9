import { stationConfigurationsInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { recordAudit } from '../audit/audit.service';
import { listStations, setStationConfigurations } from './stations.service';

export function stationsRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      method: 'get', path: '/stations', access: 'signed_in', scope: 'facility',
      handler: async (_req, res) => { res.json({ stations: await listStations(ctx.db.manager) }); },
    },
    {
      method: 'put', path: '/stations/:id/configurations', access: ['staff', 'admin'], scope: 'facility',
      handler: async (req, res) => {
        const { configurationIds } = stationConfigurationsInputSchema.parse(req.body);
        const id = param(req, 'id');
        const station = await ctx.db.transaction(async (m) => {
          const before = (await listStations(m)).find((s) => s.id === id);
          const after = await setStationConfigurations(m, id, configurationIds);
          await recordAudit(m, { actorUserId: currentUser(req).id, action: 'station.configurations_set', entityType: 'instrument', entityId: id,
            before: before ? { configurationIds: before.configurationIds } : null, after: { configurationIds: after.configurationIds }, requestId: String(req.id) });
          return after;
        });
        res.json({ station });
      },
    },
  ];
}
