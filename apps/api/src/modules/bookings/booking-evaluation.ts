import {
  checkTargetFeasibility, checkTimeline, describeCancellationPolicy, describeGaps, formatNm, localDate, type WavelengthCoverage,
  type BookingCheckDto, type BookingTarget, type TimelineCheck,
} from '@femtoslot/shared';
import { describeInstant } from '@femtoslot/shared/time/format-instant';
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import { AppError, notFound } from '../../lib/errors/app-error';
import type { Account } from '../accounts/account.entity';
import type { Configuration } from '../instruments/configuration.entity';
import type { Organisation } from '../organisations/organisation.entity';
import type { ReferenceCache, ReferenceData } from '../instruments/reference-data';
import type { EyewearItem } from '../safety/eyewear-item.entity';
import { checkOptics } from './optics-check';
import { authorisationFor, sessionDays } from '../training/authorisation';
import { earliestWithStationsFree, stationProblems } from '../stations/stations.service';
import { occupyingBlocks, timelineOf, toEngineBlocks, type InstrumentTimeline } from './timeline.repository';

export const bookingRoles = new Set(['collaborator', 'member', 'pi', 'staff']);

export interface Problem {
  code: string;
  message: string;
  status: number;
  details?: unknown;
}

export interface BookingRequest {
  instrumentId: string;
  configurationId: string;
  startsAt: Date;
  endsAt: Date;
  target: BookingTarget;
  accountId: string;
  /** The booking's owner (the actor, or the owner when staff move a booking). */
  owner: SessionUser;
  excludeId?: string;
  /** End stations booked with it (benches the configuration feeds). */
  stationIds?: string[];
}

export interface Evaluation {
  problems: Problem[];
  timeline: InstrumentTimeline;
  reference: ReferenceData;
  configuration: Configuration | null;
  organisation: Organisation;
  account: BookingAccount | null;
  status: 'requested' | 'approved';
  check: TimelineCheck | null;
  dto: BookingCheckDto;
}

export type BookingAccount = Pick<Account, 'id' | 'organisationId' | 'kind' | 'name' | 'poNumber' | 'poExpiresOn' | 'status'>;

/** The account the booking would be charged to (one plain statement: booking creation is hot). */
async function accountOf(m: EntityManager, accountId: string): Promise<BookingAccount | null> {
  const rows: { id: string; organisation_id: string; kind: Account['kind']; name: string; po_number: string | null; po_expires_on: string | null; status: Account['status'] }[] = await m.query(
    `SELECT a.id, a.organisation_id, a.kind, a.name, a.po_number, a.po_expires_on::text AS po_expires_on, a.status FROM accounts a WHERE a.id = $1`, [accountId]);
  const r = rows[0];
  return r ? { id: r.id, organisationId: r.organisation_id, kind: r.kind, name: r.name, poNumber: r.po_number, poExpiresOn: r.po_expires_on, status: r.status } : null;
}

const HOUR = 3_600_000;

/** Every rule a booking must pass, gathered (not thrown) so the request form can show them all at once. */
export async function evaluateBooking(m: EntityManager, cache: ReferenceCache, req: BookingRequest, opts: { lock: boolean; now?: Date; skipPolicy?: boolean }): Promise<Evaluation> {
  const now = opts.now ?? new Date();
  const problems: Problem[] = [];
  const { timeline, reference } = await timelineOf(cache, m, req.instrumentId, { lock: opts.lock });
  const facility = reference.facility;
  const p = facility.policies;
  const organisation = reference.organisations.get(req.owner.organisationId);
  if (!organisation) throw notFound('Organisation');
  const external = organisation.kind !== 'internal';
  const configuration = timeline.configurations.get(req.configurationId) ?? null;

  if (!bookingRoles.has(req.owner.role)) problems.push({ code: 'forbidden', message: `As ${req.owner.role} you cannot book beam time`, status: 403 });

  const sessionDate = localDate(req.startsAt, facility.timeZone);
  const account = await accountOf(m, req.accountId);
  if (!account || account.organisationId !== req.owner.organisationId) {
    problems.push({ code: 'account_unusable', message: 'That account does not belong to your organisation', status: 422 });
  } else if (account.status !== 'approved') {
    problems.push({ code: 'account_unusable', message: `The account "${account.name}" is ${account.status === 'pending' ? 'waiting for approval by a PI' : 'inactive'}`, status: 422 });
  } else if (account.kind === 'external' && account.poExpiresOn && account.poExpiresOn < sessionDate) {
    problems.push({ code: 'account_unusable', message: `The purchase order ${account.poNumber ?? ''} on "${account.name}" expires on ${account.poExpiresOn}, before the session`, status: 422 });
  }

  if (!opts.skipPolicy) {
    const hours = (req.endsAt.getTime() - req.startsAt.getTime()) / HOUR;
    if (hours < p.minBookingHours || hours > p.maxBookingHours) {
      problems.push({ code: 'rule_violation', message: `A booking lasts between ${p.minBookingHours} and ${p.maxBookingHours} hours; this one is ${Number(hours.toFixed(2))} h`, status: 422, details: { rule: 'length' } });
    }
    if (req.startsAt.getTime() < now.getTime()) problems.push({ code: 'rule_violation', message: 'The start is in the past', status: 422, details: { rule: 'past' } });
    if (req.startsAt.getTime() > now.getTime() + p.horizonDays * 24 * HOUR) {
      problems.push({ code: 'rule_violation', message: `Beam time can be booked at most ${p.horizonDays} days ahead`, status: 422, details: { rule: 'horizon' } });
    }
    if (external && req.startsAt.getTime() < now.getTime() + p.externalLeadHours * HOUR) {
      problems.push({ code: 'rule_violation', message: `External requests need at least ${p.externalLeadHours} hours' notice so that staff can review them`, status: 422, details: { rule: 'lead_time' } });
    }
  }

  let feasibility: ReturnType<typeof checkTargetFeasibility> | null = null;
  let coverage: ReturnType<typeof checkOptics>['coverage'] = null;
  if (!configuration || !configuration.active) {
    problems.push({ code: 'out_of_range', message: 'That configuration does not belong to this instrument', status: 422 });
  } else {
    ({ feasibility, coverage } = checkOptics(configuration, timeline.instrument, timeline.configurations.values(), req.target, reference.activeEyewear));
    for (const r of feasibility.reasons) problems.push({ code: 'out_of_range', message: r.message, status: 422, details: { reason: r.code, minNm: configuration.minNm, maxNm: configuration.maxNm, ...r.details } });
  }

  if (configuration) {
    const authorisation = await authorisationFor(m, req.owner.id, configuration.id, sessionDays(req.startsAt, req.endsAt, facility.timeZone));
    if (!authorisation.ok) {
      const on = authorisation.from === authorisation.to ? `on ${authorisation.from}` : `from ${authorisation.from} to ${authorisation.to}`;
      problems.push({
        code: 'training_required', status: 422, details: { configurationId: configuration.id, from: authorisation.from, to: authorisation.to, gaps: authorisation.gaps },
        message: `For ${configuration.name} ${on}, ${req.owner.name} lacks: ${describeGaps(authorisation.gaps)}. The laser-safety officer records training and sign-offs.`,
      });
    }
  }

  let eyewear: EyewearItem[] = [];
  let odByWavelength: BookingCheckDto['odByWavelength'] = [];
  const onTable = feasibility?.feasible ? feasibility.onTable : [];
  if (coverage) {
    eyewear = coverage.covering;
    odByWavelength = coverage.wavelengths.map((w) => ({ role: w.role ?? '', minNm: w.minNm, maxNm: w.maxNm, requiredOd: w.requiredOd, eyewear: w.covering.map((e) => ({ id: e.id, label: e.label })) }));
    if (eyewear.length === 0) problems.push(noEyewearProblem(coverage.wavelengths));
  }

  let check: TimelineCheck | null = null;
  const overlapKinds = new Set<string>();
  if (configuration && feasibility?.feasible && req.endsAt > req.startsAt) {
    const horizonEnd = new Date(now.getTime() + p.horizonDays * 24 * HOUR);
    const blocks = await occupyingBlocks(m, new Date(req.startsAt.getTime() - 2 * 24 * HOUR), new Date(Math.max(horizonEnd.getTime(), req.endsAt.getTime()) + 2 * 24 * HOUR), req.instrumentId);
    const nm = 'targetNm' in req.target ? req.target.targetNm : (req.target.minNm + req.target.maxNm) / 2;
    const engineBlocks = toEngineBlocks(blocks, timeline.configurations);
    const candidate = { id: req.excludeId, start: req.startsAt, end: req.endsAt, state: { configurationKey: configuration.key, nm } };
    check = checkTimeline(engineBlocks, candidate, { model: timeline.parsedModel, horizonEnd });
    if (req.stationIds?.length) {
      const ms = req.endsAt.getTime() - req.startsAt.getTime();
      const onSource = (from: Date) => checkTimeline(engineBlocks, { ...candidate, start: from, end: new Date(from.getTime() + ms) }, { model: timeline.parsedModel, horizonEnd }).earliestStart;
      check = { ...check, earliestStart: await earliestWithStationsFree(m, req.stationIds, req.excludeId, check.earliestStart, ms, horizonEnd, onSource) };
    }
    for (const id of check.overlaps) overlapKinds.add(blocks.find((b) => b.id === id)?.kind ?? 'booking');
    const details = {
      neededMinutes: Math.max(check.before?.neededMinutes ?? 0, check.after?.neededMinutes ?? 0),
      availableMinutes: Math.min(check.before?.availableMinutes ?? Infinity, check.after?.availableMinutes ?? Infinity),
      earliestStart: check.earliestStart?.toISOString() ?? null,
      before: check.before, after: check.after,
    };
    if (!Number.isFinite(details.availableMinutes)) details.availableMinutes = 0;
    const suggestion = check.earliestStart ? ` The earliest start that works is ${describeInstant(check.earliestStart, facility.timeZone)}.` : ' No later start within the booking horizon works.';
    if (check.overlaps.length > 0) {
      problems.push({ code: 'overlap', message: `That time overlaps another booking or a maintenance window.${suggestion}`, status: 409, details: { ...details, overlaps: check.overlaps } });
    } else {
      const short = [check.before, check.after].filter((n) => n && n.shortfallMinutes > 0);
      if (short.length > 0) {
        const worst = short.sort((a, b) => b!.shortfallMinutes - a!.shortfallMinutes)[0]!;
        problems.push({
          code: 'changeover_gap', status: 409,
          message: `The changeover needs ${worst.neededMinutes} min but only ${worst.availableMinutes} min are free between this and the neighbouring block.${suggestion}`,
          details: { ...details, neededMinutes: worst.neededMinutes, availableMinutes: worst.availableMinutes },
        });
      }
    }
  }

  if (configuration && req.stationIds?.length) {
    problems.push(...await stationProblems(m, { stationIds: req.stationIds, configurationId: configuration.id, startsAt: req.startsAt, endsAt: req.endsAt, excludeBookingId: req.excludeId, earliestStart: check?.earliestStart }));
  }

  const status: 'requested' | 'approved' = external && req.owner.role !== 'staff' ? 'requested' : 'approved';
  const dto: BookingCheckDto = {
    ok: problems.length === 0,
    problems: problems.map(({ code, message, details }) => ({ code, message, details })),
    derived: feasibility?.derived ?? {},
    onTable: onTable.map((b) => ({ role: b.role, minNm: b.minNm, maxNm: b.maxNm })),
    odByWavelength,
    eyewear: eyewear.map((e) => ({ id: e.id, label: e.label })),
    timeline: {
      before: check?.before ?? null, after: check?.after ?? null, overlaps: check?.overlaps ?? [],
      earliestStart: check?.earliestStart?.toISOString() ?? null,
      overlapsMaintenance: overlapKinds.has('maintenance'),
    },
    status,
    cancellationPolicy: describeCancellationPolicy(p),
  };
  return { problems, timeline, reference, configuration, organisation, account, status, check, dto };
}

const span = (w: { minNm: number; maxNm: number }) => (w.minNm === w.maxNm ? `${formatNm(w.minNm)} nm` : `${formatNm(w.minNm)}–${formatNm(w.maxNm)} nm`);

/** Names each wavelength no listed eyewear is rated for, with the OD the laser-safety officer set there. */
function noEyewearProblem(wavelengths: WavelengthCoverage<EyewearItem>[]): Problem {
  const uncovered = wavelengths.filter((w) => w.covering.length === 0);
  const parts = (uncovered.length ? uncovered : wavelengths).map((w) =>
    w.requiredOd === null ? `no required OD is set at ${w.unsetNm.map(span).join(', ')}` : `${span(w)} needs OD ≥ ${w.requiredOd}`);
  return {
    code: 'no_eyewear', status: 422,
    message: `No eyewear on the list covers every wavelength on the table at the OD the laser-safety officer set (${parts.join('; ')}); ask the laser-safety officer`,
    details: { odByWavelength: wavelengths.map((w) => ({ role: w.role, minNm: w.minNm, maxNm: w.maxNm, requiredOd: w.requiredOd, unsetNm: w.unsetNm })) },
  };
}

/** Refuses with the most fundamental problem first: who you are, then the rules, then the timeline. */
export function throwFirst(problems: Problem[]): void {
  const order = ['forbidden', 'account_unusable', 'rule_violation', 'out_of_range', 'station_incompatible', 'training_required', 'no_eyewear', 'overlap', 'changeover_gap', 'station_busy'];
  const first = [...problems].sort((a, b) => order.indexOf(a.code) - order.indexOf(b.code))[0];
  if (first) throw new AppError(first.code, first.message, first.status, first.details);
}
