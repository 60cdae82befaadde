import type { ButtonSize } from '@/components/ui/button-styles';
import { useMe } from '@/features/auth/api/get-me';
import { RoleSwitcher } from '@/features/auth/components/role-switcher';
import { roleEntries } from '@/features/auth/utils/role-grants';
import type { Role } from '@/types/api';
import { cn } from '@/utils/cn';

type AccountSummaryProps = { currentRole?: Role; size?: ButtonSize; className?: string };

/** Who is signed in and which of their roles is in use, with a way to switch. */
export function AccountSummary({ currentRole, size = 'md', className }: AccountSummaryProps) {
  const { data: me } = useMe();
  if (!me) return null;

  return (
    <div className={cn('flex flex-wrap items-center gap-x-4 gap-y-2', className)}>
      <p className="text-sm">
        <span className="sr-only">Signed in as </span>
        <span className="font-medium">{me.user.displayName}</span>
      </p>
      <RoleSwitcher entries={roleEntries(me.roles)} currentRole={currentRole} size={size} />
    </div>
  );
}
