import { Suspense } from 'react';
import { FileText, House } from 'lucide-react';
import { Outlet } from 'react-router-dom';

import type { NavigationItem } from '@/components/layouts/navigation';
import { PhoneLayout } from '@/components/layouts/phone-layout';
import { PublicLayout } from '@/components/layouts/public-layout';
import { LoadingStatus } from '@/components/ui/loading-status';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { AccountSummary } from '@/features/auth/components/account-summary';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { hasRole } from '@/features/auth/utils/role-grants';
import { roleHomeHref, useRoleInView } from '@/lib/roles';

/** Frame for homeowner and keyholder pages: phone-first, one column, large targets. */
export function PersonalLayoutRoute() {
  const { data: me } = useMe();
  const roleInView = useRoleInView();

  // Only after sign-out has cleared the cache, while the browser is leaving for the provider.
  if (!me) {
    return (
      <PublicLayout>
        <p className="px-6 py-12">You have signed out.</p>
      </PublicLayout>
    );
  }

  // On a refusal page the role in view is one the person lacks: show none rather than imply it.
  const currentRole = roleInView && hasRole(me, roleInView) ? roleInView : undefined;
  const homeHref = currentRole ? roleHomeHref(currentRole) : paths.app.getHref();
  const navigation: NavigationItem[] = [{ label: 'Home', href: homeHref, icon: House }];
  // Homeowners keep their handover packs, from every home, in one place.
  if (currentRole === 'homeowner') {
    navigation.push({ label: 'Documents', href: paths.documents.getHref(), icon: FileText });
  }

  return (
    <PhoneLayout
      homeHref={homeHref}
      headerAction={<SignOutButton size="lg" />}
      account={<AccountSummary currentRole={currentRole} size="lg" className="justify-between" />}
      navigation={navigation}
    >
      <Suspense fallback={<LoadingStatus label="Loading page" />}>
        <Outlet />
      </Suspense>
    </PhoneLayout>
  );
}
