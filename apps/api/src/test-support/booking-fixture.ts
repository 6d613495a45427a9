import { defaultChangeoverModel, type OrganisationKind, type Role } from '@femtoslot/shared';
import { demoConfigurations } from '@femtoslot/shared/optics/demo-configurations';
import { Account } from '../modules/accounts/account.entity';
import { ChangeoverPair } from '../modules/instruments/changeover-pair.entity';
import { Configuration } from '../modules/instruments/configuration.entity';
import { Instrument } from '../modules/instruments/instrument.entity';
import { Organisation } from '../modules/organisations/organisation.entity';
import { User } from '../modules/users/user.entity';
import { hashPassword } from '../lib/auth/passwords';
import { uniqueTag, type TestApi } from './test-api';
import { giveLaserSafetyTraining } from './training';

const PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | null = null;

/** A private source with the demo configurations and changeover model, so tests never share a timeline. */
export async function makeInstrument(t: TestApi) {
  const db = t.api.ctx.db;
  const tag = uniqueTag();
  const m = defaultChangeoverModel;
  const instrument = await db.getRepository(Instrument).save({
    name: `Test source ${tag}`, kind: 'source', pumpNm: 800, retuneMinutesPerNm: m.retuneMinutesPerNm,
    warmupAfterMaintenanceMinutes: m.warmupAfterMaintenanceMinutes, pulseCheckMinutes: m.pulseCheckMinutes, defaultChangeoverMinutes: m.defaultBaseMinutes,
  });
  const configs: Record<string, Configuration> = {};
  for (const c of demoConfigurations) {
    configs[c.key] = await db.getRepository(Configuration).save({
      instrumentId: instrument.id, key: c.key, name: c.name, outputKind: c.outputKind, minNm: c.minNm, maxNm: c.maxNm, defaultNm: c.defaultNm,
      rateClass: c.rateClass, requiredOdBands: [...c.requiredOdBands], retuneMinutesPerNm: m.retuneMinutesPerNmByConfiguration?.[c.key] ?? null,
    });
  }
  for (const p of m.pairs) {
    await db.getRepository(ChangeoverPair).insert({ instrumentId: instrument.id, fromConfigurationId: configs[p.from]!.id, toConfigurationId: configs[p.to]!.id, baseMinutes: p.baseMinutes });
  }
  return { instrument, configs: configs as Record<'fundamental' | 'shg' | 'opa_signal' | 'opa_idler' | 'dfg', Configuration> };
}

/** An organisation with one user of the role, valid training (unless told otherwise) and an approved account. */
export async function makeBooker(t: TestApi, opts: { role?: Role; kind?: OrganisationKind; trained?: boolean } = {}) {
  const db = t.api.ctx.db;
  const tag = uniqueTag();
  const kind = opts.kind ?? 'internal';
  const org = await db.getRepository(Organisation).save({ name: `Booker org ${tag}`, kind });
  passwordHash ??= hashPassword(PASSWORD);
  const user = await db.getRepository(User).save({ email: `booker.${tag}@example.test`, name: `Booker ${tag}`, role: opts.role ?? (kind === 'internal' ? 'member' : 'collaborator'), organisationId: org.id, passwordHash: await passwordHash, active: true });
  const trained = opts.trained ?? true;
  await giveLaserSafetyTraining(db, user.id, trained);
  const account: Account = await db.getRepository(Account).save<Account>(kind === 'internal'
    ? { organisationId: org.id, kind: 'cost_centre', name: `CC ${tag}`, costCentreCode: `CC-${tag}`, status: 'approved' } as Account
    : { organisationId: org.id, kind: 'external', name: `Ext ${tag}`, billingContactEmail: `ap.${tag}@example.test`, poNumber: `PO-${tag}`, poExpiresOn: '2028-12-31', status: 'approved' } as Account);
  const agent = await t.signIn(user.email, PASSWORD);
  return { org, user, account, agent };
}

/** An instant `hours` from now, on a whole quarter hour so that tests read cleanly. */
export function hoursFromNow(hours: number): Date {
  const d = new Date(Date.now() + hours * 3_600_000);
  d.setUTCMinutes(Math.ceil(d.getUTCMinutes() / 15) * 15, 0, 0);
  return d;
}

export const plusHours = (d: Date, h: number) => new Date(d.getTime() + h * 3_600_000);
export const plusMinutes = (d: Date, min: number) => new Date(d.getTime() + min * 60_000);
