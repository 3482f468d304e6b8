import type { UserDto } from '../../../shared/schemas';
import type { User } from './user.entity';

/** The public shape of a user; never carries the password hash. */
export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    disabled: u.disabled,
    units: u.units,
    organizationId: u.organization.id,
    organizationName: u.organization.name,
    hasPassword: Boolean(u.passwordHash),
    createdAt: u.createdAt.toISOString(),
    updatedAt: u.updatedAt.toISOString(),
  };
}
