import { groupSpendQuerySchema, myBeamTimeQuerySchema } from '@femtoslot/shared/billing/spend.schemas';
import { MoreThan } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import type { SessionUser } from '../../lib/auth/session';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import { groupSpend } from '../billing/spend';
import { facilityWideRoles, toBookingDto } from '../bookings/booking.dto';
import { loadLookups } from '../bookings/lookups';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { Organisation } from '../organisations/organisation.entity';

export function beamTimeRoutes(ctx: AppContext): RouteDef[] {
  const db = ctx.db;

  /** The caller's own bookings that have not ended, soonest first, whatever their status. */
  async function myBeamTime(viewer: SessionUser, limit: number) {
    const blocks = await db.getRepository(TimelineBlock).find({ where: { userId: viewer.id, kind: 'booking', endsAt: MoreThan(new Date()) }, order: { startsAt: 'ASC' }, take: limit });
    const look = await loadLookups(db.manager, blocks);
    const instruments = new Map((await db.getRepository(Instrument).find()).map((i) => [i.id, i.name]));
    const configurations = new Map((await db.getRepository(Configuration).find()).map((c) => [c.id, c.name]));
    return {
      bookings: blocks.map((b) => ({ ...toBookingDto(b, viewer, look), instrumentName: instruments.get(b.instrumentId) ?? '', configurationName: configurations.get(b.configurationId!) ?? '' })),
    };
  }

  /**
   * PIs see their own group; staff, finance and admin any group they name; members and collaborators only their own
   * bookings' spend.
   */
  async function spend(viewer: SessionUser, q: { organisationId?: string; from?: string }) {
    const facilityWide = facilityWideRoles.has(viewer.role);
    if (facilityWide && !q.organisationId) throw new AppError('validation_failed', 'Name the organisation (organisationId)', 400, [{ path: ['organisationId'], message: 'Required for facility roles' }]);
    const organisationId = q.organisationId ?? viewer.organisationId;
    if (!facilityWide && organisationId !== viewer.organisationId) throw forbidden('You can see the spend of your own group only');
    const organisation = await db.getRepository(Organisation).findOneBy({ id: organisationId });
    if (!organisation) throw notFound('Organisation');
    const facility = await db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const own = viewer.role === 'member' || viewer.role === 'collaborator';
    return groupSpend(db.manager, facility, { organisation: { id: organisation.id, name: organisation.name }, userId: own ? viewer.id : null, from: q.from ?? null });
  }

  return [
    { method: 'get', path: '/me/beam-time', access: 'signed_in', handler: async (req, res) => { res.json(await myBeamTime(currentUser(req), myBeamTimeQuerySchema.parse(req.query).limit)); } },
    { method: 'get', path: '/groups/spend', access: 'signed_in', scope: 'organisation', handler: async (req, res) => { res.json(await spend(currentUser(req), groupSpendQuerySchema.parse(req.query))); } },
  ];
}
