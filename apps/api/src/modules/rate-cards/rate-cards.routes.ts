import { rateCardInputSchema, ratePreviewInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { rateCardsService } from './rate-cards.service';

export function rateCardsRoutes(ctx: AppContext): RouteDef[] {
  const s = rateCardsService(ctx);
  return [
    { method: 'get', path: '/rate-cards', access: ['finance', 'admin', 'staff'], scope: 'facility', handler: async (_req, res) => { res.json(await s.list()); } },
    {
      method: 'post', path: '/rate-cards', access: ['finance'], scope: 'facility',
      handler: async (req, res) => { res.status(201).json({ rateCard: await s.create(currentUser(req), rateCardInputSchema.parse(req.body), String(req.id)) }); },
    },
    {
      method: 'post', path: '/rate-cards/preview', access: ['finance', 'admin', 'staff'], scope: 'facility',
      handler: async (req, res) => { res.json(await s.preview(ratePreviewInputSchema.parse(req.body).bookingId)); },
    },
  ];
}
