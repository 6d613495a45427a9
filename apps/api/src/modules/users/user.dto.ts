import type { User as UserDto } from '@femtoslot/shared';
import type { User } from './user.entity';

/** The only shape in which a user leaves the API: never the password hash. */
export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active,
    organisation: { id: u.organisation.id, name: u.organisation.name, kind: u.organisation.kind },
    createdAt: u.createdAt.toISOString(),
    invitationPending: !u.passwordHash,
    laserSafetyOfficer: u.isLaserSafetyOfficer,
  };
}
