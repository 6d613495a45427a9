import type { OrganisationKind } from '../auth/auth.schemas';
import type { RateClass } from '../facility/facility.schemas';
import type { PriceLine, RateTable } from './billing.schemas';
import { formatMoney, lineAmountMinor, percentLineAmountMinor } from './money';

/** The parts of a rate card that price a line. */
export interface PricingRules {
  currency: string;
  billingIncrementMinutes: number;
  changeoverSharePercent: number;
  minimumChargeMinutes: number;
  rates: RateTable;
}

export interface LineContext {
  key: string;
  bookingId: string;
  usageLogId?: string | null;
  /** Short heading, e.g. "Beam time 2026-10-06, OPA signal". */
  label: string;
  category: OrganisationKind;
  rateClass: RateClass;
}

const categoryWords: Record<OrganisationKind, string> = { internal: 'internal', external_academic: 'external academic', industry: 'industry' };
const classWords: Record<RateClass, string> = { standard: 'standard class', dfg: 'DFG class' };

export function rateFor(rules: PricingRules, category: OrganisationKind, rateClass: RateClass): number {
  return rules.rates[category][rateClass];
}

/** Whole minutes between two instants, a started minute counting as a minute; real elapsed time, so DST-safe. */
export function elapsedMinutes(start: Date, end: Date): number {
  return Math.max(0, Math.ceil((end.getTime() - start.getTime()) / 60_000));
}

/** Rounded up to the billing increment (facility policy: 15 min by default). */
export function roundUpToIncrement(minutes: number, incrementMinutes: number): number {
  if (!Number.isInteger(incrementMinutes) || incrementMinutes < 1) throw new Error('The billing increment must be a positive whole number of minutes');
  return Math.ceil(minutes / incrementMinutes) * incrementMinutes;
}

export function formatDuration(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h && m) return `${h} h ${m} min`;
  return h ? `${h} h` : `${m} min`;
}

function rateWords(rules: PricingRules, c: LineContext, rate: number): string {
  return `${formatMoney(rate, rules.currency)}/h ${classWords[c.rateClass]}, ${categoryWords[c.category]}`;
}

function line(c: LineContext, kind: PriceLine['kind'], minutes: number, rate: number, amountMinor: number, explanation: string): PriceLine {
  return { key: c.key, kind, bookingId: c.bookingId, usageLogId: c.usageLogId ?? null, label: c.label, explanation, minutes, rateMinorPerHour: rate, amountMinor, category: c.category, rateClass: c.rateClass };
}

/** A confirmed session: actual minutes rounded up to the increment, never below the minimum charge. */
export function usageLines(rules: PricingRules, c: LineContext, actual: { start: Date; end: Date }, changeoverMinutes = 0): PriceLine[] {
  const rate = rateFor(rules, c.category, c.rateClass);
  const used = elapsedMinutes(actual.start, actual.end);
  const rounded = roundUpToIncrement(used, rules.billingIncrementMinutes);
  const billed = Math.max(rounded, rules.minimumChargeMinutes);
  const why = billed > rounded ? `minimum charge; ${formatDuration(used)} used`
    : rounded !== used ? `rounded up from ${formatDuration(used)}` : null;
  const lines = [line(c, 'usage', billed, rate, lineAmountMinor(billed, rate), `${formatDuration(billed)}${why ? ` (${why})` : ''} × ${rateWords(rules, c, rate)}`)];
  if (rules.changeoverSharePercent > 0 && changeoverMinutes > 0) {
    const amount = percentLineAmountMinor(changeoverMinutes, rate, rules.changeoverSharePercent);
    lines.push(line({ ...c, key: `${c.key}-changeover`, label: `${c.label}, changeover before the session` }, 'changeover', changeoverMinutes, rate, amount,
      `${formatDuration(changeoverMinutes)} changeover × ${rules.changeoverSharePercent} % share × ${rateWords(rules, c, rate)}`));
  }
  return lines;
}

/** A cancelled booking: fee % (decided at cancellation by the facility's windows) × booked minutes rounded up × rate. */
export function cancellationFeeLine(rules: PricingRules, c: LineContext, booked: { start: Date; end: Date }, feePercent: number, hoursBefore: number): PriceLine {
  const rate = rateFor(rules, c.category, c.rateClass);
  const minutes = roundUpToIncrement(elapsedMinutes(booked.start, booked.end), rules.billingIncrementMinutes);
  const amount = percentLineAmountMinor(minutes, rate, feePercent);
  return line(c, 'cancellation_fee', minutes, rate, amount,
    `Cancellation fee ${feePercent} % of ${formatDuration(minutes)} booked (cancelled ${Math.floor(hoursBefore)} h before the start) × ${rateWords(rules, c, rate)}`);
}

/**
 * A booking displaced by maintenance costs nothing (facility policy); the statement still lists it at zero, so the
 * account sees why the beam time it booked is not billed.
 */
export function displacementLine(rules: PricingRules, c: LineContext, booked: { start: Date; end: Date }): PriceLine {
  const rate = rateFor(rules, c.category, c.rateClass);
  const minutes = roundUpToIncrement(elapsedMinutes(booked.start, booked.end), rules.billingIncrementMinutes);
  return line(c, 'displacement', minutes, rate, 0, `${formatDuration(minutes)} booked, displaced by maintenance: no charge (would have been ${formatMoney(lineAmountMinor(minutes, rate), rules.currency)})`);
}

export function totalMinor(lines: readonly PriceLine[]): number {
  return lines.reduce((sum, l) => sum + l.amountMinor, 0);
}
