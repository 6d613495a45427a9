import type { AccountStatement, LeftOutSession, PriceLine } from '@femtoslot/shared';

/** Shapes of apps/api/src/modules/billing (billing.service.ts toPeriodDto / toJobDto / previewDto). */
export type PeriodStatus = 'open' | 'closing' | 'closed';

export interface BillingPeriod {
  id: string;
  /** YYYY-MM, a calendar month in the facility time zone */
  month: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  status: PeriodStatus;
  closedAt: string | null;
}

export type JobStatus = 'queued' | 'running' | 'completed' | 'failed';

export interface BillingJob {
  id: string;
  periodId: string;
  status: JobStatus;
  done: number;
  total: number;
  errors: { accountId: string; message: string; at: string }[];
  startedAt: string | null;
  finishedAt: string | null;
}

export type { AccountStatement, LeftOutSession };

export interface PeriodPreview {
  currency: string;
  accounts: AccountStatement[];
  totalMinor: number;
}

export interface PeriodDetail {
  period: BillingPeriod;
  preview: PeriodPreview;
  /** only while the period is open; null once its statement is frozen */
  leftOut?: LeftOutSession[] | null;
  job: BillingJob | null;
}

export const isJobActive = (job: BillingJob | null | undefined) => job?.status === 'queued' || job?.status === 'running';
