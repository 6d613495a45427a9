/**
 * A well-formed example request for every router-table route that reads a body or a query, keyed `METHOD /path`.
 * The hostile suites mutate one field at a time (NUL, lone surrogates, impossible dates), so each field's example
 * must be valid on its own: then the refusal is the mutation's, not the example's. Ids name no row (see concretePath).
 * A route added to the table without an example here fails tests/security/hostile-edges.test.ts.
 */
const id = '00000000-0000-4000-8000-000000000000';
const start = '2031-03-04T09:00:00Z';
const end = '2031-03-04T11:00:00-05:00';
const rates = { internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 11000, dfg: 13750 }, industry: { standard: 26000, dfg: 32500 } };
const segment = { configurationId: id, startsAt: start, endsAt: '2031-03-04T10:00:00Z', minNm: 1200, maxNm: 1300, averagePowerMw: 50, notes: 'scan across the signal band' };

export const bodySamples: Record<string, Record<string, unknown>> = {
  'post /auth/login': { email: 'someone@example.test', password: 'a password of some length' },
  'post /auth/logout': {},
  'post /auth/forgot-password': { email: 'someone@example.test' },
  'post /auth/reset-password': { token: 'x'.repeat(43), password: 'a new passphrase' },
  'post /auth/accept-invitation': { token: 'x'.repeat(43), password: 'a new passphrase' },
  'post /users/invitations': { email: 'new.person@example.test', name: 'New Person', role: 'member', organisationId: id },
  'patch /users/:id': { role: 'member' },
  'post /accounts': { kind: 'external', name: 'Gas sensor project', billingContactEmail: 'ap@example.test', poNumber: 'PO-1', poExpiresOn: '2031-12-31' },
  'post /accounts/:id/approve': {},
  'patch /configurations/:id': { requiredOdBands: [{ minNm: 700, maxNm: 3000, od: 7 }] },
  'post /optics/feasibility': { configurationId: id, targetNm: 1300 },
  'post /optics/autocorrelation': { shape: 'sech2', points: [[-100, 0.1], [0, 1], [100, 0.1]] },
  'post /bookings/check': { instrumentId: id, configurationId: id, startsAt: start, endsAt: end, targetNm: 1300, accountId: id, purpose: 'carrier dynamics' },
  'post /bookings': { instrumentId: id, configurationId: id, startsAt: start, endsAt: end, targetNm: 1300, accountId: id, purpose: 'carrier dynamics' },
  'post /bookings/:id/approve': {},
  'post /bookings/:id/decline': { reason: 'the source is down that week' },
  'post /bookings/:id/cancel': { reason: 'sample not ready' },
  'post /bookings/:id/move': { startsAt: start, endsAt: end, note: 'moved for maintenance' },
  'post /maintenance': { instrumentId: id, startsAt: start, endsAt: end, reason: 'pump diode swap' },
  'patch /maintenance/:id': { startsAt: start, endsAt: end, reason: 'pump diode swap' },
  'delete /maintenance/:id': {},
  'post /planner/day': { instrumentId: id, date: '2031-03-04', requests: [{ id: 'r1', durationMinutes: 120, configurationId: id, nm: 1300, earliestStart: start, latestEnd: '2031-03-04T18:00:00Z', submittedAt: '2031-03-01T09:00:00Z' }] },
  'post /planner/day/proposal': { instrumentId: id, date: '2031-03-04', flexMinutes: 60 },
  'post /planner/day/apply': { instrumentId: id, date: '2031-03-04', order: [{ bookingId: id, startsAt: start, endsAt: end }] },
  'post /calendar/feed/regenerate': {},
  'post /eyewear': { label: 'OD 7 goggles', description: 'broadband', bands: [{ minNm: 700, maxNm: 1100, od: 7 }] },
  'patch /eyewear/:id': { label: 'OD 7 goggles', description: 'broadband' },
  'delete /eyewear/:id': {},
  'post /bookings/:id/usage': { actualStartsAt: start, actualEndsAt: '2031-03-04T10:00:00Z', segments: [segment], notes: 'went well' },
  'post /usage/:id/confirm': { actualStartsAt: start, actualEndsAt: '2031-03-04T10:00:00Z', note: 'as logged' },
  'post /bookings/:id/attachments': {},
  'post /usage/:id/attachments': {},
  'post /rate-cards': { name: 'Rates 2031', effectiveFrom: '2031-01-01', effectiveTo: '2031-12-31', currency: 'USD', rates },
  'post /rate-cards/preview': { bookingId: id },
  'post /billing/periods': { month: '2031-01' },
  'post /billing/periods/:id/close': {},
  'post /instruments': { name: 'Second source', kind: 'source', description: 'a spare amplifier', pumpNm: 1030, retuneMinutesPerNm: 0.1, warmupAfterMaintenanceMinutes: 30, pulseCheckMinutes: 10, defaultChangeoverMinutes: 20, active: true },
  'post /instruments/:id/preview': { warmupAfterMaintenanceMinutes: 45 },
  'patch /instruments/:id': { warmupAfterMaintenanceMinutes: 45, description: 'realigned' },
  'post /configurations': { instrumentId: id, key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [{ minNm: 700, maxNm: 3000, od: 7 }] },
  'post /configurations/:id/preview': { minNm: 1160, maxNm: 1600 },
  'post /instruments/:id/changeover-pairs/preview': { pairs: [{ fromConfigurationId: id, toConfigurationId: '00000000-0000-4000-8000-000000000001', baseMinutes: 40 }] },
  'put /instruments/:id/changeover-pairs': { pairs: [{ fromConfigurationId: id, toConfigurationId: '00000000-0000-4000-8000-000000000001', baseMinutes: 40 }] },
  'post /bookings/estimate': { instrumentId: id, configurationId: id, startsAt: start, endsAt: end, targetNm: 1300, accountId: id },
  'post /bookings/estimate.pdf': { instrumentId: id, configurationId: id, startsAt: start, endsAt: end, targetNm: 1300, accountId: id },
  'post /training/courses': { name: 'Mid-infrared beam handling', description: 'alignment with invisible beams', validityMonths: 24 },
  'patch /training/courses/:id': { description: 'alignment with invisible beams', validityMonths: 36 },
  'put /training/requirements/:id': { courseIds: [id], signoffLabel: 'after a supervised session' },
  'post /training/records': { userId: id, courseId: id, completedOn: '2030-03-04', expiresOn: '2032-03-04', note: 'classroom and practical' },
  'post /training/records/:id/revoke': { reason: 'record entered for the wrong person' },
  'post /training/signoffs': { userId: id, configurationId: id, grantedOn: '2030-03-04', expiresOn: '2031-03-04', note: 'supervised session' },
  'post /training/signoffs/:id/revoke': { reason: 'beam left unattended' },
  'put /stations/:id/configurations': { configurationIds: [id] },
  'patch /facility/policies': { horizonDays: 90, cancellationFreeHours: 72, cancellationHalfFeeHours: 24, workingHours: { start: '08:00', end: '18:00', weekdays: [1, 2, 3, 4, 5] }, usageWindowMinutes: 60 },
};

/** Query strings of the GET routes that read one (every other GET route ignores its query). */
export const querySamples: Record<string, Record<string, string>> = {
  'get /bookings': { from: start, to: '2031-03-11T09:00:00Z', instrumentId: id },
  'get /configurations': { instrumentId: id },
  'get /optics/mixing': { pumpNm: '800', signalNm: '1300' },
  'get /usage/sessions': { scope: 'mine' },
  'get /reports/utilisation': { from: '2031-01-01T00:00:00-05:00', to: '2031-03-01T00:00:00-05:00', groupBy: 'month' },
  'get /reports/utilisation.csv': { from: '2031-01-01T00:00:00-05:00', to: '2031-03-01T00:00:00-05:00', groupBy: 'week' },
  'get /reports/tuning-coverage': { from: '2031-01-01T00:00:00Z', to: '2031-03-01T00:00:00Z' },
  'get /reports/tuning-coverage.csv': { from: '2031-01-01T00:00:00Z', to: '2031-03-01T00:00:00Z' },
};

export type Leaf = { path: (string | number)[]; value: string };

/** Every string in a sample, with its path. */
export function stringLeaves(value: unknown, path: (string | number)[] = []): Leaf[] {
  if (typeof value === 'string') return [{ path, value }];
  if (Array.isArray(value)) return value.flatMap((v, i) => stringLeaves(v, [...path, i]));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => stringLeaves(v, [...path, k]));
  return [];
}

/** A deep copy of `value` with the leaf at `path` replaced. */
export function withLeaf<T>(value: T, path: (string | number)[], replacement: unknown): T {
  if (path.length === 0) return replacement as T;
  const [head, ...rest] = path;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  copy[head!] = withLeaf(copy[head!], rest, replacement);
  return copy as T;
}

export const INSTANT = /^\d{4}-\d{2}-\d{2}T/;
export const DATE = /^\d{4}-\d{2}-\d{2}$/;
export const MONTH = /^\d{4}-\d{2}$/;
