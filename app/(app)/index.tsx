import { Redirect } from 'expo-router';
import { homeFor } from '@/constants/navigation';
import { useSession } from '@/hooks/use-session';

/** "/" has no page of its own: each role starts on its daily work. */
export default function StartRedirect() {
  const { user } = useSession();
  if (!user) return null;
  return <Redirect href={homeFor(user.role)} />;
}
