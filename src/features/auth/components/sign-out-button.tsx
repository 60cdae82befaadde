import { LoaderCircle, LogOut } from 'lucide-react';

import { Button } from '@/components/ui/button';
import type { ButtonSize } from '@/components/ui/button-styles';
import { useSignOut } from '@/features/auth/api/sign-out';

type SignOutButtonProps = { size?: ButtonSize };

export function SignOutButton({ size = 'md' }: SignOutButtonProps) {
  const signOut = useSignOut();
  // After success the browser is already leaving for the identity provider; stay disabled.
  const isLeaving = signOut.isPending || signOut.isSuccess;

  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button
        variant="on-ink"
        size={size}
        onClick={() => signOut.mutate()}
        disabled={isLeaving}
        aria-busy={isLeaving || undefined}
      >
        {isLeaving ? (
          <LoaderCircle aria-hidden="true" className="size-4 motion-safe:animate-spin" />
        ) : (
          <LogOut aria-hidden="true" className="size-4" />
        )}
        Sign out
      </Button>
      {signOut.isError ? (
        <p role="alert" className="text-sm text-brass-light">
          Could not sign out: {signOut.error.message}
        </p>
      ) : null}
    </div>
  );
}
