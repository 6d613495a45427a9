import { bookingListQuerySchema, cancelBookingInputSchema, createBookingInputSchema, declineBookingInputSchema, moveBookingInputSchema } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { currentUser, param, type RouteDef } from '../../lib/auth/routes';
import { bookingsService } from './bookings.service';

export function bookingsRoutes(ctx: AppContext): RouteDef[] {
  const s = bookingsService(ctx);
  const rid = (req: { id: unknown }) => String(req.id);
  return [
    {
      method: 'get', path: '/bookings', access: 'signed_in', scope: 'organisation',
      handler: async (req, res) => { res.json(await s.calendar(currentUser(req), bookingListQuerySchema.parse(req.query), req.referenceRevision)); },
    },
    {
      method: 'get', path: '/bookings/needs-rebooking', access: 'signed_in', scope: 'organisation',
      handler: async (req, res) => { res.json({ bookings: await s.needsRebooking(currentUser(req)) }); },
    },
    {
      method: 'get', path: '/bookings/pending', access: ['staff'],
      handler: async (req, res) => { res.json({ bookings: await s.pending(currentUser(req)) }); },
    },
    {
      method: 'post', path: '/bookings/check', access: ['collaborator', 'member', 'pi', 'staff'],
      handler: async (req, res) => { res.json(await s.check(currentUser(req), createBookingInputSchema.parse(req.body))); },
    },
    {
      method: 'post', path: '/bookings', access: ['collaborator', 'member', 'pi', 'staff'],
      handler: async (req, res) => { res.status(201).json(await s.create(currentUser(req), createBookingInputSchema.parse(req.body), rid(req))); },
    },
    {
      method: 'get', path: '/bookings/:id', access: 'signed_in', scope: 'organisation', owner: 'booking',
      handler: async (req, res) => { res.json(await s.get(currentUser(req), param(req, 'id'))); },
    },
    {
      method: 'post', path: '/bookings/:id/approve', access: ['staff'],
      handler: async (req, res) => { res.json({ booking: await s.decide(currentUser(req), param(req, 'id'), 'approved', null, rid(req)) }); },
    },
    {
      method: 'post', path: '/bookings/:id/decline', access: ['staff'],
      handler: async (req, res) => {
        const { reason } = declineBookingInputSchema.parse(req.body);
        res.json({ booking: await s.decide(currentUser(req), param(req, 'id'), 'declined', reason, rid(req)) });
      },
    },
    {
      method: 'post', path: '/bookings/:id/cancel', access: ['collaborator', 'member', 'pi', 'staff'], scope: 'organisation', owner: 'booking',
      handler: async (req, res) => {
        const { reason } = cancelBookingInputSchema.parse(req.body ?? {});
        res.json({ booking: await s.cancel(currentUser(req), param(req, 'id'), reason ?? null, rid(req)) });
      },
    },
    {
      method: 'post', path: '/bookings/:id/move', access: ['staff'],
      handler: async (req, res) => { res.json({ booking: await s.move(currentUser(req), param(req, 'id'), moveBookingInputSchema.parse(req.body), rid(req)) }); },
    },
  ];
}
