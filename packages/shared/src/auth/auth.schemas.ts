import { z } from 'zod';

export const roles = ['collaborator', 'member', 'pi', 'staff', 'finance', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const organisationKinds = ['internal', 'external_academic', 'industry'] as const;
export const organisationKindSchema = z.enum(organisationKinds);
export type OrganisationKind = z.infer<typeof organisationKindSchema>;

/** Who may invite whom: admin anyone, staff any non-admin role, pi only into their own group as member. */
export const invitableRolesBy: Record<Role, readonly Role[]> = {
  admin: roles,
  staff: ['collaborator', 'member', 'pi', 'staff', 'finance'],
  pi: ['member', 'collaborator'],
  finance: [],
  member: [],
  collaborator: [],
};

const email = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address' })).pipe(z.string().max(254));
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const loginInputSchema = z.object({
  email,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginInput = z.infer<typeof loginInputSchema>;

export const inviteInputSchema = z.object({
  email,
  name: z.string().trim().min(1, 'Enter a name').max(120),
  role: roleSchema,
  organisationId: z.uuid(),
});
export type InviteInput = z.infer<typeof inviteInputSchema>;

export const forgotPasswordInputSchema = z.object({ email });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordInputSchema>;

export const setPasswordInputSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
});
export type SetPasswordInput = z.infer<typeof setPasswordInputSchema>;

export const updateUserInputSchema = z
  .object({ role: roleSchema.optional(), active: z.boolean().optional(), laserSafetyOfficer: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.active !== undefined || v.laserSafetyOfficer !== undefined, { message: 'Give a role, an active flag or the laser-safety officer flag' });
export type UpdateUserInput = z.infer<typeof updateUserInputSchema>;

export const organisationSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: organisationKindSchema,
});
export type Organisation = z.infer<typeof organisationSchema>;

export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  organisation: organisationSchema,
  createdAt: z.string(),
  invitationPending: z.boolean(),
  /** Records and revokes training and sign-offs (a duty of a staff member or admin, not a role). */
  laserSafetyOfficer: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}
