import { z } from 'zod';
import { calendarDateSchema } from '../time/iso-schemas';

const isoDate = calendarDateSchema;
const text = (max: number) => z.string().trim().max(max);

export const courseInputSchema = z.object({
  name: z.string().trim().min(2).max(120),
  description: text(1000).default(''),
  validityMonths: z.number().int().min(1).max(120),
  requiredForAll: z.boolean().default(false),
  active: z.boolean().default(true),
});
export type CourseInput = z.infer<typeof courseInputSchema>;
export const courseUpdateSchema = courseInputSchema.partial();

export const recordTrainingInputSchema = z.object({
  userId: z.uuid(),
  courseId: z.uuid(),
  completedOn: isoDate,
  /** Defaults to the completion date plus the course's validity. */
  expiresOn: isoDate.optional(),
  note: text(500).default(''),
}).refine((v) => !v.expiresOn || v.expiresOn > v.completedOn, { message: 'The expiry must come after the completion date', path: ['expiresOn'] });
export type RecordTrainingInput = z.infer<typeof recordTrainingInputSchema>;

export const grantSignoffInputSchema = z.object({
  userId: z.uuid(),
  configurationId: z.uuid(),
  /** The first day the sign-off counts; may lie ahead (granted now for after a supervised session that is booked). */
  grantedOn: isoDate,
  expiresOn: isoDate.nullish(),
  note: text(500).default(''),
}).refine((v) => !v.expiresOn || v.expiresOn > v.grantedOn, { message: 'The expiry must come after the first valid day', path: ['expiresOn'] });
export type GrantSignoffInput = z.infer<typeof grantSignoffInputSchema>;

export const revokeInputSchema = z.object({ reason: z.string().trim().min(3, 'Give a reason of at least 3 characters').max(500) });

export const configurationRequirementsInputSchema = z.object({
  courseIds: z.array(z.uuid()).max(20).default([]),
  /** What the configuration-specific sign-off means ("DFG mid-IR only after a supervised session"); null for none. */
  signoffLabel: z.string().trim().min(3).max(200).nullable().default(null),
});
export type ConfigurationRequirementsInput = z.infer<typeof configurationRequirementsInputSchema>;

export const trainingPeopleQuerySchema = z.object({ q: z.string().trim().max(100).default('') });
export const authorisationQuerySchema = z.object({ configurationId: z.uuid(), on: isoDate.optional() });

export interface CourseDto {
  id: string;
  name: string;
  description: string;
  validityMonths: number;
  requiredForAll: boolean;
  active: boolean;
}

/** Valid on the facility's today, lapsed, revoked, or not yet in force. */
export type HoldingState = 'valid' | 'expired' | 'revoked' | 'not_yet_valid';

export interface TrainingRecordDto {
  id: string;
  userId: string;
  courseId: string;
  courseName: string;
  completedOn: string;
  expiresOn: string;
  note: string;
  recordedByName: string | null;
  revokedAt: string | null;
  revokedByName: string | null;
  revokedReason: string | null;
  state: HoldingState;
}

export interface SignoffDto {
  id: string;
  userId: string;
  configurationId: string;
  configurationName: string;
  instrumentName: string;
  grantedByName: string;
  grantedOn: string;
  expiresOn: string | null;
  note: string;
  revokedAt: string | null;
  revokedByName: string | null;
  revokedReason: string | null;
  state: HoldingState;
}

export interface ConfigurationRequirementsDto {
  configurationId: string;
  configurationName: string;
  instrumentName: string;
  /** Facility-wide courses first, then the configuration's own. */
  courses: { id: string; name: string; requiredForAll: boolean }[];
  signoffLabel: string | null;
}

/** One thing a person lacks for a configuration over a session's dates. */
export interface AuthorisationGap {
  kind: 'course' | 'signoff';
  /** The course name, or the sign-off's label. */
  name: string;
  courseId: string | null;
  reason: 'missing' | 'expired' | 'revoked' | 'not_yet_valid';
  /** The latest expiry seen (reason expired). */
  expiredOn: string | null;
  /** The first day a held record counts (reason not_yet_valid). */
  validFrom: string | null;
  revokedAt: string | null;
  revokedReason: string | null;
}

export interface AuthorisationStatus {
  configurationId: string;
  /** The session's first and last dates in the facility zone. */
  from: string;
  to: string;
  ok: boolean;
  gaps: AuthorisationGap[];
}

export interface TrainingPersonDto {
  id: string;
  name: string;
  email: string;
  role: string;
  organisationName: string;
  laserSafetyOfficer: boolean;
}

export interface PersonTrainingDto {
  person: TrainingPersonDto;
  records: TrainingRecordDto[];
  signoffs: SignoffDto[];
  /** Each active configuration's status for today (facility zone). */
  authorisations: (AuthorisationStatus & { configurationName: string; instrumentName: string })[];
}

/** Plain-English list of gaps, used by the booking refusal and the request form alike. */
export function describeGaps(gaps: AuthorisationGap[]): string {
  return gaps.map((g) => {
    const what = g.kind === 'course' ? g.name : `the sign-off "${g.name}"`;
    switch (g.reason) {
      case 'expired': return `${what} (expired ${g.expiredOn})`;
      case 'revoked': return `${what} (revoked${g.revokedReason ? `: ${g.revokedReason}` : ''})`;
      case 'not_yet_valid': return `${what} (valid only from ${g.validFrom})`;
      default: return `${what} (none on record)`;
    }
  }).join('; ');
}
