import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { InitialSchema1764633600000 } from './migrations/1764633600000-initial-schema';
import { BookingWorkflow1764720000000 } from './migrations/1764720000000-booking-workflow';
import { UsageLogs1764806400000 } from './migrations/1764806400000-usage-logs';
import { Attachment } from '../modules/attachments/attachment.entity';
import { UsageLog } from '../modules/usage/usage-log.entity';
import { UsageSegment } from '../modules/usage/usage-segment.entity';
import { Organisation } from '../modules/organisations/organisation.entity';
import { User } from '../modules/users/user.entity';
import { AuthToken } from '../modules/auth/auth-token.entity';
import { Account } from '../modules/accounts/account.entity';
import { FacilitySettings } from '../modules/facility/facility-settings.entity';
import { Instrument } from '../modules/instruments/instrument.entity';
import { Configuration } from '../modules/instruments/configuration.entity';
import { ChangeoverPair } from '../modules/instruments/changeover-pair.entity';
import { TimelineBlock } from '../modules/bookings/timeline-block.entity';
import { TrainingRecord } from '../modules/safety/training-record.entity';
import { EyewearItem } from '../modules/safety/eyewear-item.entity';
import { AuditEvent } from '../modules/audit/audit-event.entity';
import { OutboxMessage } from '../lib/mail/outbox-message.entity';

export const entities = [Organisation, User, AuthToken, Account, FacilitySettings, Instrument, Configuration,
  ChangeoverPair, TimelineBlock, TrainingRecord, EyewearItem, AuditEvent, OutboxMessage, Attachment, UsageLog, UsageSegment];
export const migrations = [InitialSchema1764633600000, BookingWorkflow1764720000000, UsageLogs1764806400000];

export function createDataSource(url: string, poolSize = 10): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging: false,
    extra: { max: poolSize, connectionTimeoutMillis: 5000 },
  });
}

// Billing (issue 6): rate cards, periods, invoices, journals, Stripe events.
import { Billing1764892800000 } from './migrations/1764892800000-billing';
import { RateCard } from '../modules/rate-cards/rate-card.entity';
import { AccountBillingDetails, BillingJob, BillingPeriod, BillingPeriodAccount, JournalLine } from '../modules/billing/billing.entities';
import { Invoice } from '../modules/invoices/invoice.entity';
import { StripeEvent } from '../modules/webhooks/stripe-event.entity';
(entities as unknown as (new () => object)[]).push(RateCard, BillingPeriod, BillingPeriodAccount, BillingJob, JournalLine, AccountBillingDetails, Invoice, StripeEvent);
(migrations as unknown as (new () => object)[]).push(Billing1764892800000);

// In-memory reference data (issue 7): one revision bumped by triggers on the tables every process caches.
import { ReferenceRevision1764979200000 } from './migrations/1764979200000-reference-revision';
(migrations as unknown as (new () => object)[]).push(ReferenceRevision1764979200000);

// A password reset ends the sessions issued before it.
import { SessionEpoch1765065600000 } from './migrations/1765065600000-session-epoch';
(migrations as unknown as (new () => object)[]).push(SessionEpoch1765065600000);

// Required OD per wavelength band, per configuration.
import { RequiredOdBands1765700000000 } from './migrations/1765700000000-required-od-bands';
(migrations as unknown as (new () => object)[]).push(RequiredOdBands1765700000000);
// Invoices keep the PO number they were issued against.
import { InvoicePoNumber1765500000000 } from './migrations/1765500000000-invoice-po-number';
(migrations as unknown as (new () => object)[]).push(InvoicePoNumber1765500000000);
// Signing out ends that session: its token id is refused until the token expires.
import { RevokedSessions1765300000000 } from './migrations/1765300000000-revoked-sessions';
import { RevokedSession } from '../modules/auth/revoked-session.entity';
(entities as unknown as (new () => object)[]).push(RevokedSession);
(migrations as unknown as (new () => object)[]).push(RevokedSessions1765300000000);
// Session-log bounds: the facility's window for actual times, a segment's spectral FWHM.
import { SessionLogBounds1765400000000 } from './migrations/1765400000000-session-log-bounds';
(migrations as unknown as (new () => object)[]).push(SessionLogBounds1765400000000);
// Training courses, configuration requirements and sign-offs, the laser-safety officer flag.
import { TrainingAuthorisation1765800000000 } from './migrations/1765800000000-training-authorisation';
import { TrainingCourse } from '../modules/training/training-course.entity';
import { ConfigurationRequirement } from '../modules/training/configuration-requirement.entity';
import { ConfigurationSignoff } from '../modules/training/configuration-signoff.entity';
(entities as unknown as (new () => object)[]).push(TrainingCourse, ConfigurationRequirement, ConfigurationSignoff);
(migrations as unknown as (new () => object)[]).push(TrainingAuthorisation1765800000000);
// Facility working hours (offers to displaced bookings prefer them).
import { FacilityWorkingHours1765600000000 } from './migrations/1765600000000-facility-working-hours';
(migrations as unknown as (new () => object)[]).push(FacilityWorkingHours1765600000000);
// End stations booked with the source: station rows on the bench timelines, the station × configuration list.
import { EndStations1765900000000 } from './migrations/1765900000000-end-stations';
import { StationConfiguration } from '../modules/stations/station-configuration.entity';
(entities as unknown as (new () => object)[]).push(StationConfiguration);
(migrations as unknown as (new () => object)[]).push(EndStations1765900000000);
