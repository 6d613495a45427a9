import type { AppContext } from '../../lib/context';
import { facilityPoliciesPatchSchema } from '@femtoslot/shared';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { updateFacilityPolicies } from './facility-policies.service';

export function facilityRoutes(ctx: AppContext): RouteDef[] {
  return [
    // The calendar's first requests: served from the reference cache, no statement beyond the session read.
    {
      method: 'get', path: '/facility', access: 'signed_in',
      handler: async (req, res) => {
        const { facility: f } = await ctx.reference.get(ctx.db.manager, req.referenceRevision);
        res.json({ facility: { name: f.name, timeZone: f.timeZone, currency: f.currency, policies: f.policies, usageWindowMinutes: f.usageWindowMinutes } });
      },
    },
    {
      method: 'patch', path: '/facility/policies', access: ['admin'],
      handler: async (req, res) => {
        const patch = facilityPoliciesPatchSchema.parse(req.body);
        res.json({ facility: await updateFacilityPolicies(ctx, patch, currentUser(req).id, String(req.id)) });
      },
    },
    {
      method: 'get', path: '/instruments', access: 'signed_in',
      handler: async (req, res) => {
        const { timelines } = await ctx.reference.get(ctx.db.manager, req.referenceRevision);
        const rows = [...timelines.values()].map((t) => t.instrument).filter((i) => i.active)
          .sort((a, b) => (a.kind === b.kind ? (a.name < b.name ? -1 : a.name > b.name ? 1 : 0) : a.kind < b.kind ? 1 : -1));
        res.json({ instruments: rows.map(({ createdAt: _c, ...i }) => i) });
      },
    },
    {
      method: 'get', path: '/configurations', access: 'signed_in',
      handler: async (req, res) => {
        const asked = typeof req.query.instrumentId === 'string' ? req.query.instrumentId : undefined;
        const instrumentId = asked && /^[0-9a-f-]{36}$/i.test(asked) ? asked : undefined;
        const { configurations } = await ctx.reference.get(ctx.db.manager, req.referenceRevision);
        const rows = [...configurations.values()]
          .filter((c) => c.active && (!instrumentId || c.instrumentId === instrumentId))
          .sort((a, b) => a.minNm - b.minNm);
        res.json({ configurations: rows });
      },
    },
  ];
}
