import { bookingEstimateInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { renderQuotePdf } from './quote-pdf';
import { estimatesService } from './estimates.service';

const bookers = ['collaborator', 'member', 'pi', 'staff'] as const;

export function estimatesRoutes(ctx: AppContext): RouteDef[] {
  const s = estimatesService(ctx);
  return [
    {
      method: 'post', path: '/bookings/estimate', access: bookers,
      handler: async (req, res) => { res.json({ estimate: await s.estimate(currentUser(req), bookingEstimateInputSchema.parse(req.body)) }); },
    },
    {
      method: 'post', path: '/bookings/estimate.pdf', access: bookers,
      handler: async (req, res) => {
        const quote = await s.estimate(currentUser(req), bookingEstimateInputSchema.parse(req.body));
        res.type('application/pdf').attachment(`${quote.quoteNumber}.pdf`).send(await renderQuotePdf(quote));
      },
    },
  ];
}
