import type { ButtonSize } from '@/components/ui/button-styles';
import { AccountSummary } from '@/features/auth/components/account-summary';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import type { Role } from '@/types/api';

type AccountBarProps = { currentRole?: Role; size?: ButtonSize };

/** The wide header's account controls on one line: person, role switcher, sign-out. */
export function AccountBar({ currentRole, size = 'md' }: AccountBarProps) {
  return (
    <div className="flex flex-wrap items-center justify-end gap-x-4 gap-y-2">
      <AccountSummary currentRole={currentRole} size={size} />
      <SignOutButton size={size} />
    </div>
  );
}
