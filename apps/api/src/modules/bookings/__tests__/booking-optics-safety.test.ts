import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Configuration } from '../../instruments/configuration.entity';
import { EyewearItem } from '../../safety/eyewear-item.entity';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, uniqueTag, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

function body(instrumentId: string, configurationId: string, accountId: string, start: Date, target: object) {
  return { instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), purpose: 'Gas cell absorption scan', ...target };
}

describe('eyewear against a required OD per wavelength band', () => {
  it('when a DFG table’s 800 nm pump residual needs OD 7.5, then an OD 5 goggle is refused and the OD per wavelength is shown', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    // Invented test ratings: the laser-safety officer sets the real ones.
    const tag = uniqueTag();
    const od5 = await t.api.ctx.db.getRepository(EyewearItem).save({ label: `OD5 broad ${tag}`, bands: [{ minNm: 190, maxNm: 11500, od: 5 }], active: true });
    const od8 = await t.api.ctx.db.getRepository(EyewearItem).save({ label: `OD8 pump ${tag}`, bands: [{ minNm: 700, maxNm: 900, od: 8 }, { minNm: 900, maxNm: 11500, od: 5 }], active: true });
    const set = await staff.patch(`/api/configurations/${configs.dfg.id}`).send({ requiredOdBands: [{ minNm: 700, maxNm: 900, od: 7.5 }, { minNm: 900, maxNm: 11500, od: 5 }] });
    expect(set.status).toBe(200);
    const me = await makeBooker(t);
    // DFG 3466.7 nm from an 800 nm pump: signal 1300, idler 2080 nm (1/λDFG = 1/λs − 1/λi, 1/λp = 1/λs + 1/λi; Boyd, Nonlinear Optics).
    const check = await me.agent.post('/api/bookings/check').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), { targetNm: 3466.67 }));
    expect(check.status).toBe(200);
    const ids = check.body.eyewear.map((e: { id: string }) => e.id);
    expect(ids).toContain(od8.id);
    expect(ids).not.toContain(od5.id);
    const pump = check.body.odByWavelength.find((w: { role: string }) => w.role === 'pump_residual');
    expect(pump).toMatchObject({ minNm: 800, maxNm: 800, requiredOd: 7.5 });
    const pumpIds = pump.eyewear.map((e: { id: string }) => e.id);
    expect(pumpIds).toContain(od8.id);
    expect(pumpIds).not.toContain(od5.id);
    const dfg = check.body.odByWavelength.find((w: { role: string }) => w.role === 'dfg');
    expect(dfg.requiredOd).toBe(5);
    expect(dfg.eyewear.map((e: { id: string }) => e.id)).toEqual(expect.arrayContaining([od5.id, od8.id]));
  });

  it('when no eyewear reaches the OD a band asks for, then 422 no_eyewear names the wavelength and the OD', async () => {
    const { instrument, configs } = await makeInstrument(t);
    await t.api.ctx.db.getRepository(Configuration).update({ id: configs.dfg.id }, { requiredOdBands: [{ minNm: 700, maxNm: 900, od: 11.5 }, { minNm: 900, maxNm: 11500, od: 5 }] });
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), { targetNm: 5000 }));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('no_eyewear');
    expect(r.body.error.message).toMatch(/800 nm needs OD ≥ 11\.5/);
  });

  it('when staff send required OD bands that are inverted or empty, then 400 with the field', async () => {
    const { configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const inverted = await staff.patch(`/api/configurations/${configs.shg.id}`).send({ requiredOdBands: [{ minNm: 900, maxNm: 700, od: 6 }] });
    expect(inverted.status).toBe(400);
    const empty = await staff.patch(`/api/configurations/${configs.shg.id}`).send({ requiredOdBands: [] });
    expect(empty.status).toBe(400);
  });
});

describe('DFG target against the instrument’s OPA ranges', () => {
  it('when a 2000 nm DFG target needs a 1142.9 nm signal, then 422 with the derived signal and idler and the OPA ranges', async () => {
    const { instrument, configs } = await makeInstrument(t);
    // Widen the DFG configuration's own range so that only the OPA ranges can refuse 2000 nm.
    await t.api.ctx.db.getRepository(Configuration).update({ id: configs.dfg.id }, { minNm: 1800 });
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), { targetNm: 2000 }));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('out_of_range');
    // 1/λs = (1/800 + 1/2000)/2 → 1142.857 nm, 1/λi = (1/800 − 1/2000)/2 → 2666.667 nm (energy conservation, Boyd,
    // Nonlinear Optics; the same figures from photon energies with hc = 1239.841984 eV·nm, CODATA 2018).
    expect(r.body.error.message).toContain('1142.9 nm');
    expect(r.body.error.details).toMatchObject({ reason: 'opa_out_of_range', role: 'signal', rangeMinNm: 1150, rangeMaxNm: 1600 });
    expect(r.body.error.details.derivedMinNm).toBeCloseTo(8000 / 7, 6);
    const check = await me.agent.post('/api/bookings/check').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), { targetNm: 2000 }));
    const opa = check.body.problems.filter((p: { details?: { reason?: string } }) => p.details?.reason === 'opa_out_of_range');
    expect(opa.map((p: { details: { role: string } }) => p.details.role)).toEqual(['signal', 'idler']);
    expect(opa[1].details.derivedMaxNm).toBeCloseTo(8000 / 3, 6);
    expect(opa[1].details).toMatchObject({ rangeMinNm: 1600, rangeMaxNm: 2600 });
  });

  it('when the DFG target is inside the OPA ranges, then it is booked', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), { targetNm: 4000 }));
    expect(r.status).toBe(201);
  });
});
