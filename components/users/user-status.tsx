import { Badge } from '@/components/ui';
import type { UserDto } from '@/shared/schemas';

/** Disabled wins over invited: a disabled person cannot sign in whether or not they chose a password. */
export function UserStatus({ user }: { user: UserDto }) {
  if (user.disabled) return <Badge label="Disabled" tone="stop" testID={`user-status-${user.id}`} />;
  if (!user.hasPassword) return <Badge label="Invited" tone="beacon" testID={`user-status-${user.id}`} />;
  return <Badge label="Active" tone="go" testID={`user-status-${user.id}`} />;
}
