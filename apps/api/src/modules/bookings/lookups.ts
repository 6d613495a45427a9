import { In, type EntityManager } from 'typeorm';
import { Account } from '../accounts/account.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Organisation } from '../organisations/organisation.entity';
import { User } from '../users/user.entity';
import type { ReferenceData } from '../instruments/reference-data';
import { stationIdsOf } from '../stations/stations.service';
import type { BookingLookups } from './booking.dto';
import type { TimelineBlock } from './timeline-block.entity';

const ids = (values: (string | null)[]) => [...new Set(values.filter((v): v is string => !!v))];

/** Loads the names and end stations a set of bookings refers to, in five queries whatever the number of bookings. */
export async function loadLookups(m: EntityManager, blocks: TimelineBlock[]): Promise<BookingLookups> {
  const bookings = blocks.filter((b) => b.kind === 'booking');
  // In sequence: a transaction's manager has one connection, and a plain request should not take four of the pool.
  const configs = await m.getRepository(Configuration).findBy({ id: In(ids(bookings.map((b) => b.configurationId))) });
  const users = await m.getRepository(User).findBy({ id: In(ids(bookings.map((b) => b.userId))) });
  const orgs = await m.getRepository(Organisation).findBy({ id: In(ids(bookings.map((b) => b.organisationId))) });
  const accounts = await m.getRepository(Account).findBy({ id: In(ids(bookings.map((b) => b.accountId))) });
  const stations = await stationIdsOf(m, bookings.filter((b) => !b.stationIds).map((b) => b.id));
  const byId = <T extends { id: string }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]));
  const c = byId(configs), u = byId(users), o = byId(orgs), a = byId(accounts);
  return {
    configurationKey: (id) => ({ key: c.get(id)?.key ?? 'unknown', outputKind: c.get(id)?.outputKind ?? 'fundamental' }),
    userName: (id) => u.get(id)?.name ?? 'Unknown user',
    organisationName: (id) => o.get(id)?.name ?? 'Unknown organisation',
    accountName: (id) => a.get(id)?.name ?? 'Unknown account',
    stationIds: (id) => stations.get(id) ?? [],
  };
}

/** Lookups from names already at hand: configurations and organisations from the reference data. */
export function lookupsOf(reference: ReferenceData, users: Map<string, string>, accounts: Map<string, string>): BookingLookups {
  return {
    configurationKey: (id) => {
      const c = reference.configurations.get(id);
      return { key: c?.key ?? 'unknown', outputKind: c?.outputKind ?? 'fundamental' };
    },
    userName: (id) => users.get(id) ?? 'Unknown user',
    organisationName: (id) => reference.organisations.get(id)?.name ?? 'Unknown organisation',
    accountName: (id) => accounts.get(id) ?? 'Unknown account',
  };
}
