import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeInstrument } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { gaussianTrace, traceCsv } from '../../../test-support/traces';

let t: TestApi;
let agent: Awaited<ReturnType<TestApi['signIn']>>;
beforeAll(async () => {
  t = await startTestApi();
  const { users } = await makePeople(t, ['member']);
  agent = await t.signIn(users.member!.email);
});
afterAll(async () => { await t?.close(); });

describe('GET /api/optics/mixing', () => {
  it('when pump 800 nm and signal 1300 nm, then idler 2080.0 nm and DFG 3466.7 nm with unit conversions (Boyd, Nonlinear Optics; CODATA 2018)', async () => {
    const r = await agent.get('/api/optics/mixing').query({ pumpNm: 800, signalNm: 1300 });
    expect(r.status).toBe(200);
    expect(r.body.idlerNm).toBeCloseTo(2080.0, 1);
    expect(r.body.dfgNm).toBeCloseTo(3466.7, 1);
    // CODATA 2018 exact c, h, e: 800 nm ↔ 1.549802 eV, 12 500 cm⁻¹, 374.7406 THz.
    expect(r.body.pump.eV).toBeCloseTo(1.549802, 6);
    expect(r.body.pump.cm1).toBeCloseTo(12500, 6);
    expect(r.body.pump.THz).toBeCloseTo(374.7406, 4);
    expect(r.body.idler.nm).toBeCloseTo(2080, 1);
  });

  it('when the signal is at degeneracy (2 × pump), then 422 degenerate; below the pump, 422 invalid_wavelengths; not numbers, 400', async () => {
    const deg = await agent.get('/api/optics/mixing').query({ pumpNm: 800, signalNm: 1600 });
    expect(deg.status).toBe(422);
    expect(deg.body.error.code).toBe('degenerate');
    const bad = await agent.get('/api/optics/mixing').query({ pumpNm: 800, signalNm: 700 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe('invalid_wavelengths');
    expect((await agent.get('/api/optics/mixing').query({ pumpNm: 'red', signalNm: 1300 })).status).toBe(400);
    expect((await t.http().get('/api/optics/mixing').query({ pumpNm: 800, signalNm: 1300 })).status).toBe(401);
  });
});

describe('POST /api/optics/feasibility', () => {
  it('when a DFG target is in range, then the table lists pump residual, signal, idler and DFG; out of range, the reason names the range', async () => {
    const { configs } = await makeInstrument(t);
    const ok = await agent.post('/api/optics/feasibility').send({ configurationId: configs.dfg!.id, targetNm: 3466.7 });
    expect(ok.status).toBe(200);
    expect(ok.body.feasible).toBe(true);
    expect(ok.body.onTable.map((b: { role: string }) => b.role).sort()).toEqual(['dfg', 'idler', 'pump_residual', 'signal']);
    // Inverse of the mixing relations with an 800 nm pump: DFG 3466.7 nm ⇐ signal 1300 nm, idler 2080 nm (Boyd).
    expect(ok.body.derived.signal.minNm).toBeCloseTo(1300, 0);
    expect(ok.body.derived.idler.minNm).toBeCloseTo(2080, 0);
    const out = await agent.post('/api/optics/feasibility').send({ configurationId: configs.shg!.id, minNm: 380, maxNm: 400 });
    expect(out.body.feasible).toBe(false);
    expect(out.body.reasons[0].code).toBe('out_of_range');
    expect(out.body.reasons[0].message).toMatch(/390.*410/);
    expect((await agent.post('/api/optics/feasibility').send({ configurationId: configs.shg!.id })).status).toBe(400);
  });
});

describe('POST /api/optics/autocorrelation', () => {
  it('when a Gaussian trace is posted as JSON, then the pulse FWHM comes back within 1 % (AC/pulse = √2, Diels & Rudolph)', async () => {
    const r = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: gaussianTrace(120) });
    expect(r.status).toBe(200);
    expect(r.body.shape).toBe('gaussian');
    expect(Math.abs(r.body.pulseFwhmFs - 120) / 120).toBeLessThan(0.01);
    expect(Math.abs(r.body.acFwhmFs - 120 * Math.SQRT2) / (120 * Math.SQRT2)).toBeLessThan(0.01);
  });

  it('when the same trace is uploaded as a semicolon CSV with a header for sech², then the pulse is AC/1.543 (Diels & Rudolph)', async () => {
    const csv = traceCsv(gaussianTrace(100), { delimiter: ';', delayDigits: 3 });
    const r = await agent.post('/api/optics/autocorrelation').field('shape', 'sech2').attach('trace', Buffer.from(csv), { filename: 'trace.csv', contentType: 'text/csv' });
    expect(r.status).toBe(200);
    expect(r.body.pulseFwhmFs).toBeCloseTo(r.body.acFwhmFs / 1.543, 0);
  });

  it('when the trace is too short, has a bad cell, or peaks at the edge, then 422 with the code (and the line number)', async () => {
    const short = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: [[0, 1], [1, 2]] });
    expect(short.status).toBe(422);
    expect(short.body.error.code).toBe('too_few_points');
    const bad = await agent.post('/api/optics/autocorrelation').field('shape', 'gaussian').attach('trace', Buffer.from('0,1\n1,2\n2,oops\n3,2\n4,1\n5,0.5\n'), 'trace.csv');
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe('non_numeric');
    expect(JSON.stringify(bad.body.error)).toMatch(/3/);
    const edge = gaussianTrace(100).filter(([d]) => d <= 0);
    const e = await agent.post('/api/optics/autocorrelation').send({ shape: 'gaussian', points: edge });
    expect(e.status).toBe(422);
    expect(e.body.error.code).toBe('peak_at_edge');
    expect((await agent.post('/api/optics/autocorrelation').send({ shape: 'triangle', points: gaussianTrace(100) })).status).toBe(400);
  });
});
