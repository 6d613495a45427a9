import { eyewearBandSchema } from '@femtoslot/shared';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { EyewearItem } from './eyewear-item.entity';

const eyewearInputSchema = z.object({
  label: z.string().trim().min(2).max(120),
  description: z.string().trim().max(500).default(''),
  bands: z.array(eyewearBandSchema).min(1, 'Give at least one wavelength band with its OD').max(20),
});
const eyewearUpdateSchema = eyewearInputSchema.partial().extend({ active: z.boolean().optional() });

export function eyewearRoutes(ctx: AppContext): RouteDef[] {
  const repo = () => ctx.db.getRepository(EyewearItem);
  return [
    { method: 'get', path: '/eyewear', access: 'signed_in', handler: async (_req, res) => { res.json({ eyewear: await repo().find({ order: { label: 'ASC' } }) }); } },
    {
      method: 'post', path: '/eyewear', access: ['staff'],
      handler: async (req, res) => {
        const input = eyewearInputSchema.parse(req.body);
        const saved = await ctx.db.transaction(async (m) => {
          const row = await m.getRepository(EyewearItem).save({ ...input, active: true });
          await recordAudit(m, { actorUserId: currentUser(req).id, action: 'eyewear.created', entityType: 'eyewear', entityId: row.id, after: { ...input } });
          return row;
        });
        res.status(201).json({ eyewear: saved });
      },
    },
    {
      method: 'patch', path: '/eyewear/:id', access: ['staff'],
      handler: async (req, res) => {
        const id = param(req, 'id');
        const input = eyewearUpdateSchema.parse(req.body);
        const saved = await ctx.db.transaction(async (m) => {
          const row = await m.getRepository(EyewearItem).findOneBy({ id });
          if (!row) throw notFound('Eyewear item');
          const before = { ...row };
          Object.assign(row, input);
          await m.getRepository(EyewearItem).save(row);
          await recordAudit(m, { actorUserId: currentUser(req).id, action: 'eyewear.updated', entityType: 'eyewear', entityId: id, before, after: { ...row } });
          return row;
        });
        res.json({ eyewear: saved });
      },
    },
    {
      method: 'delete', path: '/eyewear/:id', access: ['staff'],
      handler: async (req, res) => {
        const id = param(req, 'id');
        const r = await repo().update({ id }, { active: false });
        if (!r.affected) throw notFound('Eyewear item');
        res.status(204).end();
      },
    },
  ];
}
