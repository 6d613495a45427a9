import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bookingsService } from '../bookings.service';
import { TimelineBlock } from '../timeline-block.entity';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { waitForMail } from '../../../test-support/maildev';
import { startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('reminder 24 h before', () => {
  it('when an approved booking is created, then a reminder job is queued for 24 h before; run, it mails the owner; a moved booking’s stale job sends nothing', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    const r = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs.fundamental!.id, accountId: me.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), targetNm: 800, purpose: 'reminder test' });
    expect(r.status).toBe(201);
    const jobs: { start_after: Date }[] = await t.api.ctx.db.query(`SELECT start_after FROM pgboss.job WHERE name = 'booking-reminder' AND data->>'bookingId' = $1`, [r.body.booking.id]);
    expect(jobs).toHaveLength(1);
    expect(Math.abs(new Date(jobs[0]!.start_after).getTime() - plusHours(start, -24).getTime())).toBeLessThan(1000);

    const service = bookingsService(t.api.ctx);
    await service.sendReminder({ bookingId: r.body.booking.id, startsAt: plusHours(start, 1).toISOString() });
    await service.sendReminder({ bookingId: r.body.booking.id, startsAt: start.toISOString() });
    const mail = await waitForMail(me.user.email, { subjectIncludes: 'Reminder' });
    expect(mail.text).toMatch(/24 hours/);
    expect(mail.text).toMatch(/laser-safety officer/);
    const count = await t.api.ctx.db.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE to_address = $1 AND template = 'booking_reminder'`, [me.user.email]);
    expect(count[0].n).toBe(1);
    expect(await t.api.ctx.db.getRepository(TimelineBlock).countBy({ id: r.body.booking.id, status: 'approved' })).toBe(1);
  });
});
