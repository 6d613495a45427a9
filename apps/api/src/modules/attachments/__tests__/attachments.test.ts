import { readdirSync } from 'node:fs';
import path from 'node:path';
import { parse as parseDisposition } from 'content-disposition';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UsageLog } from '../../usage/usage-log.entity';
import { attachmentDisposition } from '../content-disposition';
import { makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

async function loggedSession() {
  const { configs } = await makeInstrument(t);
  const me = await makeBooker(t);
  const start = new Date(Date.now() - 6 * 3_600_000);
  start.setUTCMinutes(0, 0, 0);
  const b = await pastSession(t, { instrumentId: configs.opa_signal!.instrumentId, configuration: configs.opa_signal!, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 3, nm: 1300 });
  const log = await me.agent.post(`/api/bookings/${b.id}/usage`).send({
    actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(),
    segments: [{ configurationId: configs.opa_signal!.id, startsAt: start.toISOString(), endsAt: plusHours(start, 3).toISOString(), minNm: 1300, maxNm: 1300 }],
  });
  expect(log.status).toBe(200);
  return { me, b, logId: log.body.log.id as string };
}

const storedFiles = () => readdirSync(path.join(t.api.ctx.env.DATA_DIR, 'uploads')).length;

describe('uploads to a billed session log', () => {
  it('when a file is uploaded to a billed log or its booking, then 409 log_locked and nothing is stored', async () => {
    const { me, b, logId } = await loggedSession();
    const { users } = await makePeople(t, ['finance']);
    await t.api.ctx.db.getRepository(UsageLog).update({ id: logId }, { status: 'billed', billedBy: users.finance!.id, billedAt: new Date('2026-11-30T17:00:00Z') });
    const filesBefore = storedFiles();
    const toLog = await me.agent.post(`/api/usage/${logId}/attachments`).attach('file', Buffer.from('delay,signal\n0,1\n'), { filename: 'late-trace.csv', contentType: 'text/csv' });
    expect(toLog.status).toBe(409);
    expect(toLog.body.error).toMatchObject({ code: 'log_locked', details: { billedBy: users.finance!.name, billedAt: '2026-11-30T17:00:00.000Z' } });
    const toBooking = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from('delay,signal\n0,1\n'), { filename: 'late-trace.csv', contentType: 'text/csv' });
    expect(toBooking.status).toBe(409);
    expect(toBooking.body.error.code).toBe('log_locked');
    const [{ n }] = await t.api.ctx.db.query('SELECT count(*)::int AS n FROM attachments WHERE booking_id = $1', [b.id]);
    expect(n).toBe(0);
    expect((await t.api.ctx.db.getRepository(UsageLog).findOneByOrFail({ id: logId })).attachmentIds).toEqual([]);
    expect(storedFiles()).toBe(filesBefore);
  });

  it('when the log is not billed, then an upload to it is stored and listed on the log', async () => {
    const { me, logId } = await loggedSession();
    const r = await me.agent.post(`/api/usage/${logId}/attachments`).attach('file', Buffer.from('notes\n'), { filename: 'notes.txt', contentType: 'text/plain' });
    expect(r.status).toBe(201);
    expect((await t.api.ctx.db.getRepository(UsageLog).findOneByOrFail({ id: logId })).attachmentIds).toEqual([r.body.attachment.id]);
  });
});

describe('non-ASCII file names', () => {
  const name = 'Łódź-Δτ-東京.csv';
  // RFC 6266 §4.1 + RFC 5987 §3.2.1: filename as token or quoted-string of printable ASCII, then filename*=UTF-8''attr-chars
  const DISPOSITION = /^attachment; filename=(?:[!#$%&'*+.^_`|~0-9A-Za-z-]+|"[\x20-\x21\x23-\x5b\x5d-\x7e]*"); filename\*=UTF-8''[!#$&+.^_`|~0-9A-Za-z%-]+$/;

  it('when a file named Łódź-Δτ-東京.csv is uploaded, then the name is stored intact and the download names it with filename* and an ASCII fallback', async () => {
    const { me, b } = await loggedSession();
    const up = await me.agent.post(`/api/bookings/${b.id}/attachments`).attach('file', Buffer.from('delay,signal\n0,1\n'), { filename: name, contentType: 'text/csv' });
    expect(up.status).toBe(201);
    expect(up.body.attachment.originalName).toBe(name);
    const [{ original_name }] = await t.api.ctx.db.query('SELECT original_name FROM attachments WHERE id = $1', [up.body.attachment.id]);
    expect(original_name).toBe(name);
    const dl = await me.agent.get(up.body.attachment.url);
    expect(dl.status).toBe(200);
    const header = String(dl.headers['content-disposition']);
    // RFC 6266 §4.3 / RFC 5987 §3.2: ext-value = UTF-8 '' pct-encoded attr-chars, after a plain ASCII filename= (token form)
    expect(header).toBe(`attachment; filename=_odz-__-__.csv; filename*=UTF-8''%C5%81%C3%B3d%C5%BA-%CE%94%CF%84-%E6%9D%B1%E4%BA%AC.csv`);
    expect(header).toMatch(DISPOSITION);
    // A reference parser (the content-disposition package) prefers filename* and reads the name back
    expect(parseDisposition(header).parameters.filename).toBe(name);
  });

  it('when the RFC 6266 §5 example name "€ rates" is given, then filename* carries the same percent-encoding as the RFC', () => {
    // RFC 6266 §5: attachment; filename="EURO rates"; filename*=utf-8''%e2%82%ac%20rates (charset and hex are case-insensitive)
    const header = attachmentDisposition('€ rates');
    expect(header.toLowerCase()).toContain(`filename*=utf-8''%e2%82%ac%20rates`);
    expect(header).toMatch(DISPOSITION);
    expect(parseDisposition(header).parameters.filename).toBe('€ rates');
  });

  it('when the name is plain ASCII, then only filename= is sent (RFC 6266 §5 first example)', () => {
    // RFC 6266 §5: Content-Disposition: Attachment; filename=example.html (the type is case-insensitive)
    expect(attachmentDisposition('example.html')).toBe('attachment; filename=example.html');
    expect(attachmentDisposition('beam profile.png')).toBe('attachment; filename="beam profile.png"');
  });
});
