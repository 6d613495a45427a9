import http from 'node:http';
import { MAX_TRACE_LINE_CHARS, MAX_TRACE_POINTS } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { interferometricTrace } from '../../../test-support/traces';

let t: TestApi;
let agent: Awaited<ReturnType<TestApi['signIn']>>;
let cookie: string;
beforeAll(async () => {
  t = await startTestApi();
  const { users, password } = await makePeople(t, ['member']);
  agent = await t.signIn(users.member!.email);
  const login = await t.http().post('/api/auth/login').send({ email: users.member!.email, password });
  cookie = String(login.headers['set-cookie']![0]).split(';')[0]!;
});
afterAll(async () => { await t?.close(); });

/** A valid Gaussian AC trace (AC FWHM 200 fs) with `rows` samples, as CSV text. */
const bigTrace = (rows: number) => ['delay_fs,signal', ...Array.from({ length: rows }, (_, i) => {
  const d = -2000 + (4000 * i) / (rows - 1);
  return `${d.toFixed(3)},${(0.05 + Math.exp((-4 * Math.LN2 * d * d) / (200 * 200))).toFixed(5)}`;
})].join('\n');

/** POSTs a multipart trace with node's own client; `onWritten` runs once the whole body has been handed to the socket. */
function postTrace(csv: string, onWritten: () => void): Promise<{ status: number; body: unknown }> {
  const boundary = 'femtoslotboundary7d1f';
  const body = Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="shape"\r\n\r\ngaussian\r\n--${boundary}\r\nContent-Disposition: form-data; name="trace"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`),
    Buffer.from(csv), Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  const url = new URL('/api/optics/autocorrelation', t.api.url);
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: 'POST', headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': body.length } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: JSON.parse(Buffer.concat(chunks).toString('utf8')) }));
    });
    req.on('error', reject);
    req.end(body, onWritten);
  });
}

describe('POST /api/optics/autocorrelation with large and hostile input', () => {
  it('when 2 MB of degenerate CSV arrive (one endless cell, a sea of semicolons), then 422 with the limit, never 500', async () => {
    const endless = await agent.post('/api/optics/autocorrelation').field('shape', 'gaussian').attach('trace', Buffer.from(`delay,signal\n0,${'1'.repeat(2_000_000)}x\n`), 'degenerate.csv');
    expect(endless.status).toBe(422);
    expect(endless.body.error).toMatchObject({ code: 'line_too_long', details: { line: 2, maximum: MAX_TRACE_LINE_CHARS } });
    const semis = await agent.post('/api/optics/autocorrelation').field('shape', 'gaussian').attach('trace', Buffer.from(`${'1;'.repeat(200)}\n`.repeat(4900)), 'semis.csv');
    expect(semis.status).toBe(422);
    expect(semis.body.error.code).toBe('wrong_columns');
  });

  it('when 150 000 JSON points arrive, then 422 too_many_points names the limit', async () => {
    const points = Array.from({ length: 150_000 }, (_, i) => [i, Number(Math.exp(-(((i - 75_000) / 3000) ** 2)).toFixed(3))]);
    const r = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points });
    expect(r.status).toBe(422);
    expect(r.body.error).toMatchObject({ code: 'too_many_points', details: { maximum: MAX_TRACE_POINTS, count: 150_000 } });
  });

  it('when a 90 000-row CSV arrives, then it is analysed (200) and its 200 fs AC width comes back', async () => {
    const r = await agent.post('/api/optics/autocorrelation').field('shape', 'gaussian').attach('trace', Buffer.from(bigTrace(90_000)), 'long.csv');
    expect(r.status).toBe(200);
    // Source: built as a Gaussian AC of 200 fs FWHM; Gaussian AC/pulse = √2 (Diels & Rudolph)
    expect(r.body.acFwhmFs).toBeCloseTo(200, 0);
  });

  it('when a large trace is being analysed, then health requests sent after it are answered before it completes', async () => {
    let pending = true;
    let answeredMeanwhile = 0;
    let healthLoop: Promise<void> = Promise.resolve();
    const upload = postTrace(bigTrace(90_000), () => {
      healthLoop = (async () => {
        while (pending) {
          const h = await t.http().get('/api/health');
          expect(h.status).toBe(200);
          if (pending) answeredMeanwhile += 1;
        }
      })();
    });
    const result = await upload;
    pending = false;
    await healthLoop;
    expect(result.status).toBe(200);
    // Read in one blocking pass, no request queued behind the upload could be answered before it (0 or 1 that slipped
    // in while the body was still arriving); read in steps, several are.
    expect(answeredMeanwhile).toBeGreaterThanOrEqual(3);
  });
});

describe('POST /api/optics/autocorrelation physical limits', () => {
  it('when a fringe-resolved trace at 800 nm is posted, then 422 below_optical_cycle with the figures', async () => {
    const r = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: interferometricTrace(30, 800), centreNm: 800 });
    expect(r.status).toBe(422);
    // Source: one optical cycle T = λ/c = 800 nm / 299 792 458 m/s = 2.6685 fs (CODATA 2018 c)
    expect(r.body.error).toMatchObject({ code: 'below_optical_cycle', details: { centreNm: 800, opticalCycleFs: expect.closeTo(2.6685, 3) } });
    expect(r.body.error.details.pulseFwhmFs).toBeLessThan(1);
    expect(r.body.error.message).toMatch(/interferometric/);
  });

  it('when no centre wavelength is given, then the shortest wavelength the facility configures sets the cycle, and the fringe trace is still refused', async () => {
    const csv = ['delay_fs,signal', ...interferometricTrace(30, 800).map(([d, s]) => `${d},${s}`)].join('\n');
    const r = await agent.post('/api/optics/autocorrelation').field('shape', 'sech2').attach('trace', Buffer.from(csv), 'fringes.csv');
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('below_optical_cycle');
    const [{ shortest }] = await t.api.ctx.db.query(`SELECT min(min_nm)::float AS shortest FROM configurations WHERE active`);
    expect(r.body.error.details.centreNm).toBe(shortest);
  });

  it('when a spectral bandwidth is given, then a width below the transform limit is 422 below_transform_limit and one above it passes', async () => {
    const { gaussianTrace } = await import('../../../test-support/traces');
    // 60 fs Gaussian at 800 nm needs Δλ ≤ 15.7 nm (TBP 0.441, Diels & Rudolph): 20 nm allows 47.1 fs, 10 nm allows 94.2 fs
    const ok = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: gaussianTrace(60), centreNm: 800, spectralFwhmNm: 20 });
    expect(ok.status).toBe(200);
    expect(ok.body.transformLimitedFs).toBeCloseTo(47.1, 1);
    const bad = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: gaussianTrace(60), centreNm: 800, spectralFwhmNm: 10 });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatchObject({ code: 'below_transform_limit', details: { transformLimitedFs: expect.closeTo(94.2, 1), shape: 'gaussian' } });
  });
});
