import { PublicLayout } from '@/components/layouts/public-layout';
import { useMe } from '@/features/auth/api/get-me';
import { SignOutButton } from '@/features/auth/components/sign-out-button';

/**
 * /app redirects anyone with a role to that role's home in its loader, so this screen is only
 * seen by a signed-in account that has no role yet.
 */
export function AppEntryRoute() {
  const { data: me } = useMe();

  return (
    <PublicLayout headerAside={me ? <SignOutButton /> : null}>
      <title>No role yet · Wardbook</title>
      <div className="mx-auto max-w-2xl px-4 py-12 md:px-6">
        <h1 className="text-2xl font-semibold tracking-tight md:text-3xl">
          Your account has no role yet
        </h1>
        <p className="mt-4 text-ink-muted">
          {me
            ? `You are signed in as ${me.user.displayName} (${me.user.email}), but your account`
            : 'Your account'}{' '}
          is not linked to an alarm company, a monitoring centre or a home yet. Ask whoever invited
          you to check the invitation, then sign in again.
        </p>
      </div>
    </PublicLayout>
  );
}
