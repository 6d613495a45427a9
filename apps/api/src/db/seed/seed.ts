import { localDate, zonedToUtc } from '@femtoslot/shared';
import { demoConfigurations } from '@femtoslot/shared/optics/demo-configurations';
import { defaultChangeoverModel } from '@femtoslot/shared/changeover/default-changeover-model';
import type { DataSource, EntityManager } from 'typeorm';
import { hashPassword } from '../../lib/auth/passwords';
import { Account } from '../../modules/accounts/account.entity';
import { FacilitySettings } from '../../modules/facility/facility-settings.entity';
import { ChangeoverPair } from '../../modules/instruments/changeover-pair.entity';
import { Configuration } from '../../modules/instruments/configuration.entity';
import { Instrument } from '../../modules/instruments/instrument.entity';
import { Organisation } from '../../modules/organisations/organisation.entity';
import { EyewearItem } from '../../modules/safety/eyewear-item.entity';
import { TimelineBlock } from '../../modules/bookings/timeline-block.entity';
import { User } from '../../modules/users/user.entity';
import { UsageLog } from '../../modules/usage/usage-log.entity';
import { UsageSegment } from '../../modules/usage/usage-segment.entity';
import { demoAccounts, demoEyewear, demoFacility, demoInstruments, demoOrganisations, demoPassword, demoUsers } from './demo-data';
import { demoRateCard } from './demo-data';
import { seedBilling } from '../../modules/billing/seed-billing';
import { seedTraining } from './seed-training';
import { seedStations } from '../../modules/stations/seed-stations';

const addDays = (isoDate: string, days: number) => {
  const d = new Date(`${isoDate}T12:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

function at(isoDate: string, hour: number, minute: number): Date {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  return zonedToUtc({ year, month, day, hour, minute }, demoFacility.timeZone);
}

/** Seeds the demo scenario once: a database that already has its facility row is left as it is. */
export async function seedDemo(db: DataSource, now = new Date()): Promise<'seeded' | 'already-seeded'> {
  return db.transaction(async (m) => {
    await m.query('LOCK TABLE facility_settings IN EXCLUSIVE MODE');
    if (await m.getRepository(FacilitySettings).exists({ where: { id: 1 } })) return 'already-seeded';
    await m.getRepository(FacilitySettings).insert({ id: 1, ...demoFacility });
    await seedPeople(m, now);
    await seedInstruments(m);
    await seedTraining(m, localDate(now, demoFacility.timeZone));
    await seedTimeline(m, now);
    await seedUsageLogs(m);
    await seedStations(m, now, demoFacility.timeZone);
    await seedBilling(m, now, demoRateCard);
    return 'seeded';
  });
}

async function seedPeople(m: EntityManager, now: Date): Promise<void> {
  const orgIds = new Map<string, string>();
  for (const o of demoOrganisations) {
    const row = await m.getRepository(Organisation).save({ name: o.name, kind: o.kind });
    orgIds.set(o.key, row.id);
  }
  const hash = await hashPassword(demoPassword);
  const today = localDate(now, demoFacility.timeZone);
  for (const u of demoUsers) {
    await m.getRepository(User).save({ email: u.email, name: u.name, role: u.role, organisationId: orgIds.get(u.org)!, passwordHash: hash, active: true });
  }
  const staff = await m.getRepository(User).findOneByOrFail({ email: 'staff@harrowpoint.test' });
  for (const a of demoAccounts) {
    const pi = await m.getRepository(User).findOne({ where: { organisationId: orgIds.get(a.org)!, role: 'pi' } });
    await m.getRepository(Account).insert({
      organisationId: orgIds.get(a.org)!, kind: a.kind, name: a.name, costCentreCode: a.costCentreCode, billingContactEmail: a.billingContactEmail,
      poNumber: a.poNumber, poExpiresOn: a.poNumber ? addDays(today, 180) : null, status: 'approved', approvedBy: (pi ?? staff).id, approvedAt: now,
    });
  }
  for (const e of demoEyewear) await m.getRepository(EyewearItem).insert(e);
}

async function seedInstruments(m: EntityManager): Promise<void> {
  for (const i of demoInstruments) {
    const source = i.kind === 'source';
    const instrument = await m.getRepository(Instrument).save({
      name: i.name, kind: i.kind, description: i.description, pumpNm: i.pumpNm,
      retuneMinutesPerNm: source ? defaultChangeoverModel.retuneMinutesPerNm : 0,
      warmupAfterMaintenanceMinutes: source ? defaultChangeoverModel.warmupAfterMaintenanceMinutes : 0,
      pulseCheckMinutes: source ? defaultChangeoverModel.pulseCheckMinutes : 0,
      defaultChangeoverMinutes: source ? defaultChangeoverModel.defaultBaseMinutes : 0,
      active: true,
    });
    if (!source) continue;
    const byKey = new Map<string, string>();
    for (const c of demoConfigurations) {
      const row = await m.getRepository(Configuration).save({
        instrumentId: instrument.id, key: c.key, name: c.name, outputKind: c.outputKind, minNm: c.minNm, maxNm: c.maxNm,
        defaultNm: c.defaultNm, rateClass: c.rateClass, requiredOdBands: [...c.requiredOdBands], active: true,
        retuneMinutesPerNm: defaultChangeoverModel.retuneMinutesPerNmByConfiguration?.[c.key] ?? null,
      });
      byKey.set(c.key, row.id);
    }
    for (const p of defaultChangeoverModel.pairs) {
      const from = byKey.get(p.from);
      const to = byKey.get(p.to);
      if (from && to) await m.getRepository(ChangeoverPair).insert({ instrumentId: instrument.id, fromConfigurationId: from, toConfigurationId: to, baseMinutes: p.baseMinutes });
    }
  }
}

/** A few weeks of beam time around today: past sessions completed, upcoming ones approved or awaiting staff. */
async function seedTimeline(m: EntityManager, now: Date): Promise<void> {
  const aurora = await m.getRepository(Instrument).findOneByOrFail({ name: 'Aurora line' });
  const configs = await m.getRepository(Configuration).find({ where: { instrumentId: aurora.id } });
  const cfg = (key: string) => configs.find((c) => c.key === key)!;
  const users = await m.getRepository(User).find();
  const accounts = await m.getRepository(Account).find();
  const who = (email: string) => {
    const u = users.find((x) => x.email === email)!;
    return { user: u, account: accounts.find((a) => a.organisationId === u.organisationId)! };
  };
  const rotation: { email: string; key: string; nm: number; purpose: string }[] = [
    { email: 'member@harrowpoint.test', key: 'fundamental', nm: 800, purpose: 'Carrier lifetime in InGaAs quantum wells (pump-probe)' },
    { email: 'collaborator@harrowpoint.test', key: 'opa_signal', nm: 1310, purpose: 'Transient absorption of solvated dyes' },
    { email: 'sensors@sedgeline.test', key: 'dfg', nm: 4260, purpose: 'CO₂ band response of a mid-IR detector prototype' },
    { email: 'wren.member@harrowpoint.test', key: 'shg', nm: 400, purpose: 'Ultrafast reflectivity of a layered oxide' },
    { email: 'member@harrowpoint.test', key: 'opa_idler', nm: 2050, purpose: 'Gain recovery of a 2 µm laser diode' },
    { email: 'sensors@sedgeline.test', key: 'dfg', nm: 3400, purpose: 'Methane line test for a gas-cell module' },
  ];
  const today = localDate(now, demoFacility.timeZone);
  const staff = who('staff@harrowpoint.test').user;
  const maintenanceDay = addDays(today, 3);
  let n = 0;
  for (let offset = -21; offset <= 21; offset++) {
    const day = addDays(today, offset);
    const weekday = new Date(`${day}T12:00:00Z`).getUTCDay();
    if (weekday === 0 || weekday === 6) continue;
    const slots: [number, number, number, number][] = day === maintenanceDay ? [[14, 0, 17, 30]] : [[9, 0, 12, 0], [14, 0, 17, 30]];
    for (const [sh, sm, eh, em] of slots) {
      const r = rotation[n++ % rotation.length]!;
      const { user, account } = who(r.email);
      const c = cfg(r.key);
      const startsAt = at(day, sh, sm);
      const past = startsAt.getTime() < now.getTime() - 6 * 3_600_000;
      const external = user.role === 'collaborator';
      const status = past ? 'completed' : external && offset > 4 && n % 2 === 0 ? 'requested' : 'approved';
      await m.getRepository(TimelineBlock).insert({
        instrumentId: aurora.id, kind: 'booking', status, startsAt, endsAt: at(day, eh, em), configurationId: c.id,
        targetMinNm: r.nm, targetMaxNm: r.nm, accountId: account.id, userId: user.id, organisationId: user.organisationId,
        purpose: r.purpose, createdBy: user.id,
      });
    }
  }
  await m.getRepository(TimelineBlock).insert({
    instrumentId: aurora.id, kind: 'maintenance', status: 'scheduled', startsAt: at(maintenanceDay, 8, 0), endsAt: at(maintenanceDay, 12, 0),
    reason: 'Pump laser diode service and OPA crystal cleaning', createdBy: staff.id,
  });
}

/** Logs for the completed demo sessions: invented ranges, powers and pulse durations, most confirmed by staff. */
async function seedUsageLogs(m: EntityManager): Promise<void> {
  const staff = await m.getRepository(User).findOneByOrFail({ email: 'staff@harrowpoint.test' });
  const configs = new Map((await m.getRepository(Configuration).find()).map((c) => [c.id, c]));
  const done = await m.getRepository(TimelineBlock).find({ where: { kind: 'booking', status: 'completed' }, order: { startsAt: 'ASC' } });
  let i = 0;
  for (const b of done) {
    i++;
    if (i % 5 === 0) continue; // a few sessions still wait for their log
    const c = configs.get(b.configurationId!)!;
    const span = Math.max(1, (c.maxNm - c.minNm) * 0.04);
    const lo = Math.max(c.minNm, b.targetMinNm! - span * ((i % 3) + 1));
    const hi = Math.min(c.maxNm, b.targetMaxNm! + span * ((i % 2) + 1));
    const lateMinutes = (i % 4) * 5;
    const log = await m.getRepository(UsageLog).save({
      bookingId: b.id, status: i % 3 === 0 ? 'submitted' : 'confirmed', actualStartsAt: new Date(b.startsAt.getTime() + lateMinutes * 60_000), actualEndsAt: b.endsAt,
      outsideGrace: false, notes: 'Demo log', attachmentIds: [], submittedBy: b.userId!, submittedAt: b.endsAt,
      confirmedBy: i % 3 === 0 ? null : staff.id, confirmedAt: i % 3 === 0 ? null : new Date(b.endsAt.getTime() + 3_600_000), billedBy: null, billedAt: null,
    } as Omit<UsageLog, 'id'>);
    await m.getRepository(UsageSegment).insert({
      usageLogId: log.id, configurationId: c.id, startsAt: log.actualStartsAt, endsAt: log.actualEndsAt, minNm: Math.round(lo * 10) / 10, maxNm: Math.round(hi * 10) / 10,
      averagePowerMw: c.outputKind === 'dfg' ? 12 + (i % 5) : 250 + 20 * (i % 6), pulseFwhmFs: c.outputKind === 'fundamental' ? 38 + (i % 7) * 1.5 : null,
      pulseShape: c.outputKind === 'fundamental' ? 'sech2' : null, traceAttachmentId: null, notes: '',
    });
  }
}
