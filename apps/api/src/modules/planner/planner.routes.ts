import { calendarDateSchema, isoInstantSchema } from '@femtoslot/shared';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { plannerService } from './planner.service';

const date = calendarDateSchema;
const instant = isoInstantSchema();
const adHocSchema = z.object({
  instrumentId: z.uuid(),
  date,
  requests: z.array(z.object({
    id: z.string().min(1).max(64),
    durationMinutes: z.number().positive().max(12 * 60),
    configurationId: z.uuid(),
    nm: z.number().positive(),
    earliestStart: instant.optional(),
    latestEnd: instant.optional(),
    submittedAt: instant.optional(),
  })).min(1).max(60),
});
const proposalSchema = z.object({ instrumentId: z.uuid(), date, flexMinutes: z.number().int().min(0).max(12 * 60).default(120) });
const applySchema = z.object({
  instrumentId: z.uuid(),
  date,
  order: z.array(z.object({ bookingId: z.uuid(), startsAt: instant, endsAt: instant })).min(1).max(60),
});

export function plannerRoutes(ctx: AppContext): RouteDef[] {
  const s = plannerService(ctx);
  return [
    { method: 'post', path: '/planner/day', access: ['staff'], handler: async (req, res) => { res.json({ plan: await s.planAdHoc(adHocSchema.parse(req.body)) }); } },
    { method: 'post', path: '/planner/day/proposal', access: ['staff'], handler: async (req, res) => { res.json({ plan: await s.propose(proposalSchema.parse(req.body)) }); } },
    { method: 'post', path: '/planner/day/apply', access: ['staff'], handler: async (req, res) => { res.json({ bookings: await s.apply(currentUser(req), applySchema.parse(req.body), String(req.id)) }); } },
  ];
}
