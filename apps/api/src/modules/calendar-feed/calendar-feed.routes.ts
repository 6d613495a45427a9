import { randomBytes } from 'node:crypto';
import { In, MoreThan } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { currentUser, type RouteDef } from '../../lib/auth/routes';
import { buildCalendar } from '../../lib/calendar/ics';
import { notFound } from '../../lib/errors/app-error';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { stationIdsOf } from '../stations/stations.service';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { User } from '../users/user.entity';

const newToken = () => randomBytes(24).toString('base64url');

export function calendarFeedRoutes(ctx: AppContext): RouteDef[] {
  const users = () => ctx.db.getRepository(User);
  const feedUrl = (token: string) => `${ctx.env.APP_URL}/api/calendar/${token}.ics`;

  async function tokenFor(userId: string, regenerate: boolean): Promise<string> {
    const user = await users().findOneByOrFail({ id: userId });
    if (user.calendarToken && !regenerate) return user.calendarToken;
    const token = newToken();
    await users().update({ id: userId }, { calendarToken: token });
    return token;
  }

  return [
    { method: 'get', path: '/calendar/feed', access: 'signed_in', handler: async (req, res) => { res.json({ url: feedUrl(await tokenFor(currentUser(req).id, false)) }); } },
    { method: 'post', path: '/calendar/feed/regenerate', access: 'signed_in', handler: async (req, res) => { res.json({ url: feedUrl(await tokenFor(currentUser(req).id, true)) }); } },
    {
      // The secret in the path is the credential (calendar clients cannot send cookies); a regenerated token retires the old URL.
      method: 'get', path: '/calendar/:file', access: 'public',
      handler: async (req, res) => {
        const m = /^([A-Za-z0-9_-]{20,64})\.ics$/.exec(String(req.params.file));
        if (!m) throw notFound('Calendar feed');
        const user = await users().findOne({ where: { calendarToken: m[1], active: true } });
        if (!user) throw notFound('Calendar feed');
        const staffView = user.role === 'staff';
        const since = new Date(Date.now() - 30 * 86_400_000);
        const blocks = await ctx.db.getRepository(TimelineBlock).find({
          where: staffView
            ? { kind: In(['booking', 'maintenance']), status: In(['requested', 'approved', 'completed', 'scheduled']), endsAt: MoreThan(since) }
            : { userId: user.id, kind: 'booking', status: In(['requested', 'approved', 'completed', 'cancelled', 'displaced']), endsAt: MoreThan(since) },
          order: { startsAt: 'ASC' },
        });
        const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
        const configs = new Map((await ctx.db.getRepository(Configuration).find()).map((c) => [c.id, c]));
        const instruments = new Map((await ctx.db.getRepository(Instrument).find()).map((i) => [i.id, i]));
        const stations = await stationIdsOf(ctx.db.manager, blocks.filter((b) => b.kind === 'booking').map((b) => b.id));
        const ics = buildCalendar(blocks.map((b) => {
          const c = b.configurationId ? configs.get(b.configurationId) : undefined;
          const nm = b.targetMinNm === b.targetMaxNm ? `${b.targetMinNm} nm` : `${b.targetMinNm}–${b.targetMaxNm} nm`;
          return {
            id: b.id, startsAt: b.startsAt, endsAt: b.endsAt, sequence: b.sequence,
            title: b.kind === 'maintenance' ? `Maintenance: ${b.reason}` : `Beam time: ${c?.name ?? 'booking'} ${nm}${b.status === 'requested' ? ' (awaiting approval)' : ''}`,
            description: b.kind === 'maintenance' ? (b.reason ?? '') : (b.purpose ?? ''),
            location: `${facility.name} — ${[b.instrumentId, ...(stations.get(b.id) ?? [])].map((id) => instruments.get(id)?.name ?? '').join(', ')}`,
            status: b.status === 'requested' ? 'TENTATIVE' : b.status === 'cancelled' || b.status === 'displaced' ? 'CANCELLED' : 'CONFIRMED',
          };
        }), 'PUBLISH', `Femtoslot — ${user.name}`);
        res.type('text/calendar; charset=utf-8').set('Cache-Control', 'private, max-age=300').send(ics);
      },
    },
  ];
}
