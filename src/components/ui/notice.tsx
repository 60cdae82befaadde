import type { ReactNode } from 'react';
import { CircleCheck, Info, Siren, TriangleAlert, type LucideIcon } from 'lucide-react';

import { cn } from '@/utils/cn';

export type NoticeTone = 'alarm' | 'fault' | 'normal' | 'info';

// Every tone pairs its colour with an icon and the notice's own title: never colour alone.
const toneStyles: Record<NoticeTone, { icon: LucideIcon; border: string; iconColour: string }> = {
  alarm: { icon: Siren, border: 'border-l-alarm', iconColour: 'text-alarm' },
  fault: { icon: TriangleAlert, border: 'border-l-fault', iconColour: 'text-fault' },
  normal: { icon: CircleCheck, border: 'border-l-normal', iconColour: 'text-normal' },
  info: { icon: Info, border: 'border-l-info', iconColour: 'text-info' },
};

type NoticeProps = {
  tone: NoticeTone;
  title: string;
  icon?: LucideIcon;
  children?: ReactNode;
  className?: string;
};

export function Notice({ tone, title, icon, children, className }: NoticeProps) {
  const style = toneStyles[tone];
  const Icon = icon ?? style.icon;
  return (
    <div
      className={cn(
        'flex gap-3 rounded-md border border-l-4 border-hairline bg-white p-4',
        style.border,
        className,
      )}
    >
      <Icon aria-hidden="true" className={cn('mt-0.5 size-5 shrink-0', style.iconColour)} />
      <div>
        <p className="font-semibold">{title}</p>
        {children ? <div className="mt-1 text-sm text-ink-muted">{children}</div> : null}
      </div>
    </div>
  );
}
