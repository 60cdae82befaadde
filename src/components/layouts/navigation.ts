import type { LucideIcon } from 'lucide-react';

export type NavigationItem = {
  label: string;
  href: string;
  icon: LucideIcon;
  /** Highlight only on this exact path (Home); otherwise also on pages below it (Sites). */
  exact?: boolean;
};
