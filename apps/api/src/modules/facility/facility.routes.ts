import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { recordAudit } from '../audit/audit.service';
import { notFound } from '../../lib/errors/app-error';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { FacilitySettings } from './facility-settings.entity';

export function facilityRoutes(ctx: AppContext): RouteDef[] {
  return [
    {
      method: 'get', path: '/facility', access: 'signed_in',
      handler: async (_req, res) => {
        const f = await ctx.db.getRepository(FacilitySettings).findOne({ where: { id: 1 } });
        if (!f) throw notFound('Facility settings');
        res.json({ facility: { name: f.name, timeZone: f.timeZone, currency: f.currency, policies: f.policies } });
      },
    },
    {
      method: 'get', path: '/instruments', access: 'signed_in',
      handler: async (_req, res) => {
        const rows = await ctx.db.getRepository(Instrument).find({ where: { active: true }, order: { kind: 'DESC', name: 'ASC' } });
        res.json({ instruments: rows.map(({ createdAt: _c, ...i }) => i) });
      },
    },
    {
      method: 'get', path: '/configurations', access: 'signed_in',
      handler: async (req, res) => {
        const instrumentId = typeof req.query.instrumentId === 'string' ? req.query.instrumentId : undefined;
        const rows = await ctx.db.getRepository(Configuration).find({
          where: { active: true, ...(instrumentId && /^[0-9a-f-]{36}$/i.test(instrumentId) ? { instrumentId } : {}) },
          order: { minNm: 'ASC' },
        });
        res.json({ configurations: rows });
      },
    },
    {
      // The OD is set by the laser-safety officer; staff record it here.
      method: 'patch', path: '/configurations/:id', access: ['staff'],
      handler: async (req, res) => {
        const id = param(req, 'id');
        const input = z.object({ requiredOd: z.number().min(0).max(12) }).parse(req.body);
        const saved = await ctx.db.transaction(async (m) => {
          const row = await m.getRepository(Configuration).findOneBy({ id });
          if (!row) throw notFound('Configuration');
          const before = { requiredOd: row.requiredOd };
          row.requiredOd = input.requiredOd;
          await m.getRepository(Configuration).save(row);
          await recordAudit(m, { actorUserId: currentUser(req).id, action: 'configuration.od_changed', entityType: 'configuration', entityId: id, before, after: { requiredOd: row.requiredOd } });
          return row;
        });
        res.json({ configuration: saved });
      },
    },
  ];
}
