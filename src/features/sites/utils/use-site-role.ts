import type { SiteRole } from '@/config/paths';
import { useRoleInView } from '@/lib/roles';

/**
 * The role whose site pages are open. These routes exist only under /engineer and /office, so
 * anything else means the page was mounted somewhere it does not belong.
 */
export function useSiteRole(): SiteRole {
  const role = useRoleInView();
  if (role !== 'engineer' && role !== 'office') {
    throw new Error(`Site pages are for engineers and office staff, not ${role ?? 'nobody'}.`);
  }
  return role;
}
