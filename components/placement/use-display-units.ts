import { useSession } from '@/hooks/use-session';
import { resolveUnits, type UnitSystem } from '@/shared/units';

/** The units to show: the project's own setting when it has one, else the person's preference. */
export function useDisplayUnits(project?: { units: UnitSystem | null } | null): UnitSystem {
  const { user } = useSession();
  return resolveUnits(project?.units, user?.units);
}
