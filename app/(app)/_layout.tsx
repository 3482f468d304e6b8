import { Redirect, Slot, usePathname } from 'expo-router';
import { AppShell } from '@/components/shell/app-shell';
import { homeFor, mayVisit } from '@/constants/navigation';
import { useSession } from '@/hooks/use-session';

/**
 * Signed-in frame. The root guard already ensures a user; this layout only decides which sections
 * the role sees, and sends a typed-in URL outside them to the role's home.
 */
export default function AppLayout() {
  const { user } = useSession();
  const pathname = usePathname();
  if (!user) return null;
  if (!mayVisit(user.role, pathname)) return <Redirect href={homeFor(user.role)} />;
  return (
    <AppShell user={user} pathname={pathname}>
      <Slot />
    </AppShell>
  );
}
