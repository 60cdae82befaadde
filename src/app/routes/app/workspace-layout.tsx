import { Suspense } from 'react';
import { Building2, Calculator, CalendarDays, House, Settings } from 'lucide-react';
import { Outlet } from 'react-router-dom';

import type { NavigationItem } from '@/components/layouts/navigation';
import { PublicLayout } from '@/components/layouts/public-layout';
import { WideLayout } from '@/components/layouts/wide-layout';
import { LoadingStatus } from '@/components/ui/loading-status';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { AccountBar } from '@/features/auth/components/account-bar';
import { roleEntries } from '@/features/auth/utils/role-grants';
import { useRenewSession } from '@/features/auth/utils/use-renew-session';
import { OutboxSender } from '@/features/commissioning/components/outbox-sender';
import { roleHomeHref, roleLabels, useRoleInView } from '@/lib/roles';

/** Frame for engineer, office and operator pages: header, left navigation, wide content. */
export function WorkspaceLayoutRoute() {
  const { data: me } = useMe();
  const roleInView = useRoleInView();
  const renewSession = useRenewSession(me?.user.id);

  // Only after sign-out has cleared the cache, while the browser is leaving for the provider.
  if (!me) {
    return (
      <PublicLayout>
        <p className="px-6 py-12">You have signed out.</p>
      </PublicLayout>
    );
  }

  // On a refusal page the role in view is one the person lacks: show none rather than imply it.
  const current = roleEntries(me.roles).find((entry) => entry.role === roleInView);
  const homeHref = current ? roleHomeHref(current.role) : paths.app.getHref();
  const navigation: NavigationItem[] = [{ label: 'Home', href: homeHref, icon: House }];
  // Engineers and office staff keep the company's site records.
  if (current?.role === 'engineer' || current?.role === 'office') {
    navigation.push({
      label: 'Sites',
      href: paths.sites.list.getHref(current.role),
      icon: Building2,
      exact: false,
    });
    navigation.push({
      label: 'Service schedule',
      href: paths.service.getHref(current.role),
      icon: CalendarDays,
    });
    navigation.push({
      label: 'Calculators',
      href: paths.calculators.getHref(current.role),
      icon: Calculator,
    });
  }
  // The office keeps the company's own settings, such as pack numbering and the sealing key.
  if (current?.role === 'office') {
    navigation.push({ label: 'Settings', href: paths.officeSettings.getHref(), icon: Settings });
  }

  return (
    <WideLayout
      homeHref={homeHref}
      account={<AccountBar currentRole={current?.role} />}
      context={
        current ? (
          <>
            <p className="font-semibold">{roleLabels[current.role]}</p>
            {current.organisationNames.length > 0 ? (
              <p className="text-ink-muted">{current.organisationNames.join(', ')}</p>
            ) : null}
          </>
        ) : null
      }
      navigation={navigation}
    >
      {/* Commissioning tests saved without a connection go as soon as one is back. */}
      {current?.role === 'engineer' || current?.role === 'office' ? (
        <OutboxSender userId={me.user.id} renewSession={renewSession} />
      ) : null}
      <Suspense fallback={<LoadingStatus label="Loading page" />}>
        <Outlet />
      </Suspense>
    </WideLayout>
  );
}
