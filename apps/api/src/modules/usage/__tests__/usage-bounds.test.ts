import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UsageLog } from '../usage-log.entity';
import { UsageSegment } from '../usage-segment.entity';
import { makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { gaussianTrace, interferometricTrace, traceCsv } from '../../../test-support/traces';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

/** A 3 h OPA-signal session that ended three hours ago, booked at 1300 nm. */
async function setup() {
  const { configs } = await makeInstrument(t);
  const { instrument } = { instrument: { id: configs.opa_signal!.instrumentId } };
  const me = await makeBooker(t);
  const start = new Date(Date.now() - 6 * 3_600_000);
  start.setUTCMinutes(0, 0, 0);
  const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal!, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 3, nm: 1300 });
  return { configId: configs.opa_signal!.id, me, b, start, end: plusHours(start, 3) };
}

const body = (configId: string, from: Date, to: Date, extra: object = {}) => ({
  actualStartsAt: from.toISOString(), actualEndsAt: to.toISOString(),
  segments: [{ configurationId: configId, startsAt: from.toISOString(), endsAt: to.toISOString(), minNm: 1300, maxNm: 1300, ...extra }],
});

async function staffAgent() {
  const { users } = await makePeople(t, ['staff']);
  return t.signIn(users.staff!.email);
}

describe('actual times are bounded by the booking and the facility window', () => {
  it('when actual times run from year 0001 to 9999, then 422 outside_booking_window names the allowed window and nothing is stored', async () => {
    const { configId, me, b, start, end } = await setup();
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, new Date('0001-01-01T00:00:00Z'), new Date('9999-12-31T23:00:00Z')));
    expect(r.status).toBe(422);
    expect(r.body.error).toMatchObject({
      code: 'outside_booking_window',
      details: { windowMinutes: 60, earliestStartsAt: plusMinutes(start, -60).toISOString(), latestEndsAt: plusMinutes(end, 60).toISOString() },
    });
    expect(await t.api.ctx.db.getRepository(UsageLog).countBy({ bookingId: b.id })).toBe(0);
  });

  it('when the session starts 61 min early, then it is refused; 60 min early, then it is kept and flagged outside the grace', async () => {
    const { configId, me, b, start, end } = await setup();
    const early = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, plusMinutes(start, -61), end));
    expect(early.status).toBe(422);
    expect(early.body.error.code).toBe('outside_booking_window');
    const edge = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, plusMinutes(start, -60), end));
    expect(edge.status).toBe(200);
    expect(edge.body.log.outsideGrace).toBe(true);
    expect((await me.agent.get(`/api/bookings/${b.id}/usage`)).body.window).toEqual({
      windowMinutes: 60, earliestStartsAt: plusMinutes(start, -60).toISOString(), latestEndsAt: plusMinutes(end, 60).toISOString(),
    });
  });

  it('when staff confirm with times outside the window, then 422; with times past the grace, then the flag is recomputed on the server both ways', async () => {
    const { configId, me, b, start, end } = await setup();
    const saved = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end));
    expect(saved.body.log.outsideGrace).toBe(false);
    const staff = await staffAgent();
    const wild = await staff.post(`/api/usage/${saved.body.log.id}/confirm`).send({ actualEndsAt: '9999-12-31T23:00:00Z' });
    expect(wild.status).toBe(422);
    expect(wild.body.error).toMatchObject({ code: 'outside_booking_window', details: { latestEndsAt: plusMinutes(end, 60).toISOString() } });
    const late = await staff.post(`/api/usage/${saved.body.log.id}/confirm`).send({ actualEndsAt: plusMinutes(end, 45).toISOString() });
    expect(late.status).toBe(200);
    expect(late.body.log).toMatchObject({ status: 'confirmed', outsideGrace: true });

    const other = await setup();
    const flagged = await other.me.agent.post(`/api/bookings/${other.b.id}/usage`).send(body(other.configId, plusMinutes(other.start, -50), other.end));
    expect(flagged.body.log.outsideGrace).toBe(true);
    const back = await staff.post(`/api/usage/${flagged.body.log.id}/confirm`).send({ actualStartsAt: other.start.toISOString() });
    expect(back.status).toBe(422); // the segment still starts 50 min early
    await other.me.agent.post(`/api/bookings/${other.b.id}/usage`).send({ ...body(other.configId, plusMinutes(other.start, -50), other.end), segments: body(other.configId, other.start, other.end).segments });
    const fixed = await staff.post(`/api/usage/${flagged.body.log.id}/confirm`).send({ actualStartsAt: other.start.toISOString() });
    expect(fixed.status).toBe(200);
    expect(fixed.body.log.outsideGrace).toBe(false);
  });
});

describe('pulse durations in a session log are the server\'s and physical', () => {
  const upload = async (agent: Awaited<ReturnType<typeof makeBooker>>['agent'], bookingId: string, csv: string) => {
    const r = await agent.post(`/api/bookings/${bookingId}/attachments`).attach('file', Buffer.from(csv), { filename: 'trace.csv', contentType: 'text/csv' });
    expect(r.status).toBe(201);
    return r.body.attachment.id as string;
  };

  it('when the browser claims 80 fs for a trace of a 100 fs Gaussian pulse, then the server recomputes it and stores 100 fs', async () => {
    const { configId, me, b, start, end } = await setup();
    const traceId = await upload(me.agent, b.id, traceCsv(gaussianTrace(100)));
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end, { pulseFwhmFs: 80, pulseShape: 'gaussian', traceAttachmentId: traceId }));
    expect(r.status).toBe(200);
    // Source: the trace is a Gaussian AC √2 × 100 fs wide (Diels & Rudolph): the server's pulse is 100 fs within 1 %
    expect(Math.abs(r.body.log.segments[0].pulseFwhmFs - 100)).toBeLessThan(1);
    const stored = await t.api.ctx.db.getRepository(UsageSegment).findOneByOrFail({ usageLogId: r.body.log.id });
    expect(Math.abs(stored.pulseFwhmFs! - 100)).toBeLessThan(1);
  });

  it('when a fringe-resolved trace is attached, then 422 below_optical_cycle with the cycle at the segment wavelength, and nothing is stored', async () => {
    const { configId, me, b, start, end } = await setup();
    const traceId = await upload(me.agent, b.id, traceCsv(interferometricTrace(30, 1300), { delayDigits: 4 }));
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end, { pulseFwhmFs: 0.62, pulseShape: 'gaussian', traceAttachmentId: traceId }));
    expect(r.status).toBe(422);
    // Source: T = λ/c = 1300 nm / 299 792 458 m/s = 4.3363 fs (CODATA 2018 c)
    expect(r.body.error).toMatchObject({ code: 'below_optical_cycle', details: { segment: 0, centreNm: 1300, opticalCycleFs: expect.closeTo(4.3363, 3) } });
    expect(await t.api.ctx.db.getRepository(UsageLog).countBy({ bookingId: b.id })).toBe(0);
  });

  it('when a typed pulse is below one cycle or below the transform limit of the given bandwidth, then 422 says which', async () => {
    const { configId, me, b, start, end } = await setup();
    const typed = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end, { pulseFwhmFs: 2 }));
    expect(typed.status).toBe(422);
    expect(typed.body.error.code).toBe('below_optical_cycle');
    // Source: TBP 4 ln²(1+√2)/π² = 0.3148 (sech², Diels & Rudolph); Δν = cΔλ/λ² = 299792458 × 20e-9 / (1300e-9)² = 3.5478 THz → limit 0.31483 / 3.5478 THz = 88.74 fs
    const tight = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end, { pulseFwhmFs: 80, pulseShape: 'sech2', spectralFwhmNm: 20 }));
    expect(tight.status).toBe(422);
    expect(tight.body.error).toMatchObject({ code: 'below_transform_limit', details: { segment: 0, transformLimitedFs: expect.closeTo(88.74, 2) } });
    const fine = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body(configId, start, end, { pulseFwhmFs: 95, pulseShape: 'sech2', spectralFwhmNm: 20 }));
    expect(fine.status).toBe(200);
    expect(fine.body.log.segments[0]).toMatchObject({ pulseFwhmFs: 95, spectralFwhmNm: 20, pulseShape: 'sech2' });
  });
});
