import { describe, expect, it } from 'vitest';
import { invitableRolesBy, loginInputSchema, setPasswordInputSchema } from './auth.schemas';

describe('auth schemas', () => {
  it('when an e-mail has capitals and spaces, then it is normalised to lower case', () => {
    expect(loginInputSchema.parse({ email: '  Staff@HarrowPoint.test ', password: 'x' }).email).toBe('staff@harrowpoint.test');
  });
  it('when an e-mail is malformed, then parsing fails on the email field', () => {
    const r = loginInputSchema.safeParse({ email: 'not-an-email', password: 'x' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['email']);
  });
  it('when a new password is short, then it is refused', () => {
    expect(setPasswordInputSchema.safeParse({ token: 'a'.repeat(43), password: 'short' }).success).toBe(false);
  });
  it('when a pi invites, then only members and collaborators are allowed', () => {
    expect(invitableRolesBy.pi).toEqual(['member', 'collaborator']);
    expect(invitableRolesBy.member).toEqual([]);
  });
});
