import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UsageLog } from '../usage-log.entity';
import { usageService } from '../usage.service';
import { makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { waitForMail } from '../../../test-support/maildev';
import { pastSession } from '../../../test-support/past-session';
import { gaussianTrace, traceCsv } from '../../../test-support/traces';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

/** A Gaussian pulse's autocorrelation trace as CSV (AC FWHM = √2 × pulse FWHM, Diels & Rudolph). */
const acCsv = (pulseFs: number) => traceCsv(gaussianTrace(pulseFs, { baseline: 0.02, samplesPerFwhm: 30 }), { lineEnd: '\r\n' });

async function setup(kind: 'opa_signal' | 'dfg' = 'opa_signal') {
  const { instrument, configs } = await makeInstrument(t);
  const me = await makeBooker(t);
  const start = new Date(Date.now() - 6 * 3_600_000);
  start.setUTCMinutes(0, 0, 0);
  const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs[kind], accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 3, nm: 1300 });
  return { instrument, configs, me, b, start };
}

const segment = (configurationId: string, s: Date, e: Date, minNm: number, maxNm: number, extra: object = {}) =>
  ({ configurationId, startsAt: s.toISOString(), endsAt: e.toISOString(), minNm, maxNm, ...extra });

describe('session log', () => {
  it('when a member logs a session with a trace upload and two segments, then the log is stored, the booking completes, and staff confirm with an audited adjustment', async () => {
    const { configs, me, b, start } = await setup();
    const up = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from(acCsv(80)), { filename: 'ac-trace.csv', contentType: 'text/csv' });
    expect(up.status).toBe(201);
    expect(up.body.attachment).toMatchObject({ contentType: 'text/csv', originalName: 'ac-trace.csv' });
    const pulse = await me.agent.post('/api/optics/autocorrelation').field('shape', 'gaussian').attach('trace', Buffer.from(acCsv(80)), 'ac-trace.csv');
    expect(Math.abs(pulse.body.pulseFwhmFs - 80) / 80).toBeLessThan(0.01);
    const body = {
      actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(), notes: 'Scanned the signal then parked at 1450 nm',
      segments: [
        segment(configs.opa_signal.id, start, plusHours(start, 2), 1250, 1400, { averagePowerMw: 350, pulseFwhmFs: pulse.body.pulseFwhmFs, pulseShape: 'gaussian', traceAttachmentId: up.body.attachment.id }),
        segment(configs.opa_signal.id, plusHours(start, 2), plusHours(start, 3), 1450, 1450, { averagePowerMw: 300 }),
      ],
    };
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body);
    expect(r.status).toBe(200);
    expect(r.body.log).toMatchObject({ status: 'submitted', outsideGrace: false });
    expect(r.body.log.segments).toHaveLength(2);
    expect(r.body.log.attachments.map((a: { id: string }) => a.id)).toEqual([up.body.attachment.id]);
    const got = await me.agent.get(`/api/bookings/${b.id}/usage`);
    expect(got.body.booking.status).toBe('completed');

    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const queue = await staff.get('/api/usage/sessions').query({ scope: 'to_confirm' });
    expect(queue.body.sessions.map((s: { booking: { id: string } }) => s.booking.id)).toContain(b.id);
    const c = await staff.post(`/api/usage/${r.body.log.id}/confirm`).send({ actualEndsAt: plusHours(start, 3.25).toISOString(), note: 'ran 15 min over' });
    expect(c.status).toBe(200);
    expect(c.body.log).toMatchObject({ status: 'confirmed', actualEndsAt: plusHours(start, 3.25).toISOString() });
    const audit = await t.api.ctx.db.query(`SELECT action, before->>'actualEndsAt' AS b, after->>'actualEndsAt' AS a FROM audit_events WHERE entity_id = $1 ORDER BY id`, [r.body.log.id]);
    expect(audit.map((x: { action: string }) => x.action)).toEqual(['usage.submitted', 'usage.confirmed']);
    expect(audit[1]).toMatchObject({ b: plusHours(start, 3).toISOString(), a: plusHours(start, 3.25).toISOString() });
    expect((await me.agent.post(`/api/usage/${r.body.log.id}/confirm`).send({})).status).toBe(403);
  });

  it.each([
    ['a range outside the tuning range', 'out_of_range', (c: string, s: Date) => [segment(c, s, plusHours(s, 3), 1100, 1300)]],
    ['overlapping segments', 'segments_overlap', (c: string, s: Date) => [segment(c, s, plusHours(s, 2), 1300, 1300), segment(c, plusHours(s, 1), plusHours(s, 3), 1400, 1400)]],
    ['a segment leaving the session', 'segment_outside_session', (c: string, s: Date) => [segment(c, s, plusHours(s, 4), 1300, 1300)]],
  ])('when the log has %s, then 422 %s with a plain message and nothing is stored', async (_label, code, segments) => {
    const { configs, me, b, start } = await setup();
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send({ actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(), segments: segments(configs.opa_signal.id, start) });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe(code);
    if (code === 'out_of_range') expect(r.body.error.message).toMatch(/1150.*1600/);
    expect(await t.api.ctx.db.getRepository(UsageLog).countBy({ bookingId: b.id })).toBe(0);
  });

  it('when someone of another organisation logs the booking, then 403; when the times leave the booking by more than the grace, then it is flagged', async () => {
    const { configs, me, b, start } = await setup();
    const other = await makeBooker(t);
    const body = { actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(), segments: [segment(configs.opa_signal.id, start, plusHours(start, 3), 1300, 1300)] };
    expect((await other.agent.post(`/api/bookings/${b.id}/usage`).send(body)).status).toBe(403);
    expect((await other.agent.get(`/api/bookings/${b.id}/usage`)).status).toBe(403);
    const late = { ...body, actualStartsAt: plusHours(start, -1).toISOString(), segments: [segment(configs.opa_signal.id, plusHours(start, -1), plusHours(start, 3), 1300, 1300)] };
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(late);
    expect(r.status).toBe(200);
    expect(r.body.log.outsideGrace).toBe(true);
  });

  it('when a log has been billed, then editing or confirming it is 409 log_locked naming who billed it and when', async () => {
    const { configs, me, b, start } = await setup();
    const body = { actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(), segments: [segment(configs.opa_signal.id, start, plusHours(start, 3), 1300, 1300)] };
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body);
    const { users } = await makePeople(t, ['finance', 'staff']);
    const billedAt = new Date('2026-11-30T17:00:00Z');
    await t.api.ctx.db.getRepository(UsageLog).update({ id: r.body.log.id }, { status: 'billed', billedBy: users.finance!.id, billedAt });
    const edit = await me.agent.post(`/api/bookings/${b.id}/usage`).send(body);
    expect(edit.status).toBe(409);
    expect(edit.body.error).toMatchObject({ code: 'log_locked', details: { billedBy: users.finance!.name, billedAt: billedAt.toISOString() } });
    const staff = await t.signIn(users.staff!.email);
    expect((await staff.post(`/api/usage/${r.body.log.id}/confirm`).send({})).status).toBe(409);
  });

  it('when a session ended without a log, then the reminder mails the owner; with a log, it sends nothing', async () => {
    const { me, b } = await setup();
    await usageService(t.api.ctx).remind({ bookingId: b.id });
    const mail = await waitForMail(me.user.email, { subjectIncludes: 'log your session' });
    expect(mail.text).toMatch(/no session log yet/);
  });
});

describe('uploads', () => {
  const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from('0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201e2a3c5a70000000049454e44ae426082', 'hex')]);

  it('when a real PNG and a PDF are uploaded, then they are stored with their content type and download for the owner only', async () => {
    const { me, b } = await setup();
    const p = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', png, { filename: 'beam-profile.png', contentType: 'image/png' });
    expect(p.status).toBe(201);
    expect(p.body.attachment.contentType).toBe('image/png');
    const pdf = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n'), 'notes.pdf');
    expect(pdf.status).toBe(201);
    expect(pdf.body.attachment.contentType).toBe('application/pdf');
    const dl = await me.agent.get(p.body.attachment.url).buffer(true).parse((res, cb) => { const chunks: Buffer[] = []; res.on('data', (c: Buffer) => chunks.push(c)); res.on('end', () => cb(null, Buffer.concat(chunks))); });
    expect(dl.status).toBe(200);
    expect(dl.headers['content-type']).toBe('image/png');
    expect(dl.headers['content-disposition']).toMatch(/^attachment; filename="?beam-profile.png"?$/);
    expect(Buffer.compare(dl.body as Buffer, png)).toBe(0);
    expect((await t.http().get(p.body.attachment.url)).status).toBe(401);
    const other = await makeBooker(t);
    expect((await other.agent.get(p.body.attachment.url)).status).toBe(403);
  });

  it('when the upload is too large, a script renamed .png, an executable, or named with ../, then it is refused and nothing is stored', async () => {
    const { me, b } = await setup();
    const big = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.alloc(10 * 1024 * 1024 + 1, 65), 'big.txt');
    expect(big.status).toBe(413);
    const script = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from('<script>alert(1)</script>'), { filename: 'innocent.png', contentType: 'image/png' });
    expect(script.status).toBe(415);
    expect(script.body.error.code).toBe('unsupported_type');
    const elf = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(64)]), 'tool.csv');
    expect(elf.status).toBe(415);
    const traversal = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from('a,b\n1,2\n'), { filepath: '../../etc/cron.d/x.csv', contentType: 'text/csv' } as never);
    expect(traversal.status).toBe(400);
    expect(traversal.body.error.code).toBe('bad_filename');
    const count = await t.api.ctx.db.query('SELECT count(*)::int AS n FROM attachments WHERE booking_id = $1', [b.id]);
    expect(count[0].n).toBe(0);
  });
});
