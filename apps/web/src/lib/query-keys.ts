/** Every query key in the web app comes from one of these factories. */
export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  invitation: (token: string) => [...authKeys.all, 'invitation', token] as const,
};

export const facilityKeys = {
  all: ['facility'] as const,
  detail: () => [...facilityKeys.all, 'detail'] as const,
};

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

export const organisationKeys = {
  all: ['organisations'] as const,
  list: () => [...organisationKeys.all, 'list'] as const,
};

export interface CalendarRange {
  from: string;
  to: string;
  instrumentId?: string;
}

export const bookingKeys = {
  all: ['bookings'] as const,
  calendars: () => [...bookingKeys.all, 'calendar'] as const,
  calendar: (range: CalendarRange) => [...bookingKeys.calendars(), range] as const,
  details: () => [...bookingKeys.all, 'detail'] as const,
  detail: (id: string) => [...bookingKeys.details(), id] as const,
  needsRebooking: () => [...bookingKeys.all, 'needs-rebooking'] as const,
  pending: () => [...bookingKeys.all, 'pending'] as const,
  check: (body: unknown) => [...bookingKeys.all, 'check', body] as const,
};

export const instrumentKeys = {
  all: ['instruments'] as const,
  list: () => [...instrumentKeys.all, 'list'] as const,
};

export const configurationKeys = {
  all: ['configurations'] as const,
  list: (instrumentId?: string) => [...configurationKeys.all, 'list', instrumentId ?? 'all'] as const,
};

export const accountKeys = {
  all: ['accounts'] as const,
  list: () => [...accountKeys.all, 'list'] as const,
};

export const eyewearKeys = {
  all: ['eyewear'] as const,
  list: () => [...eyewearKeys.all, 'list'] as const,
};

export const calendarFeedKeys = {
  all: ['calendar-feed'] as const,
  url: () => [...calendarFeedKeys.all, 'url'] as const,
};

export type UsageScope = 'mine' | 'to_confirm';

export const usageKeys = {
  all: ['usage'] as const,
  sessions: (scope: UsageScope) => [...usageKeys.all, 'sessions', scope] as const,
  booking: (bookingId: string) => [...usageKeys.all, 'booking', bookingId] as const,
};

export interface ReportQuery {
  from: string;
  to: string;
  groupBy: 'week' | 'month';
  instrumentId?: string;
}

export const reportKeys = {
  all: ['reports'] as const,
  utilisation: (query: ReportQuery) => [...reportKeys.all, 'utilisation', query] as const,
  tuningCoverage: (query: Omit<ReportQuery, 'groupBy'>) => [...reportKeys.all, 'tuning-coverage', query] as const,
};

export const billingKeys = {
  all: ['billing'] as const,
  periods: () => [...billingKeys.all, 'periods'] as const,
  period: (id: string) => [...billingKeys.all, 'period', id] as const,
  job: (id: string) => [...billingKeys.all, 'job', id] as const,
};

export const invoiceKeys = {
  all: ['invoices'] as const,
  list: () => [...invoiceKeys.all, 'list'] as const,
};

export const rateCardKeys = {
  all: ['rate-cards'] as const,
  list: () => [...rateCardKeys.all, 'list'] as const,
};

export const instrumentAdminKeys = {
  all: ['instrument-admin'] as const,
  list: () => [...instrumentAdminKeys.all, 'list'] as const,
};

export const estimateKeys = {
  all: ['estimates'] as const,
  forRequest: (body: unknown) => [...estimateKeys.all, 'request', body] as const,
};

export const beamTimeKeys = {
  all: ['beam-time'] as const,
  mine: () => [...beamTimeKeys.all, 'mine'] as const,
  spend: (query: { organisationId?: string; from?: string }) => [...beamTimeKeys.all, 'spend', query] as const,
};

export const trainingKeys = {
  all: ['training'] as const,
  me: () => [...trainingKeys.all, 'me'] as const,
  courses: () => [...trainingKeys.all, 'courses'] as const,
  requirements: () => [...trainingKeys.all, 'requirements'] as const,
  people: (q: string) => [...trainingKeys.all, 'people', q] as const,
  person: (id: string) => [...trainingKeys.all, 'person', id] as const,
};

export const stationKeys = {
  all: ['stations'] as const,
  list: () => [...stationKeys.all, 'list'] as const,
};
