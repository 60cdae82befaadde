import type { PackSummary } from '@server/handover/schema';
import { Ban, History, ShieldCheck, type LucideIcon } from 'lucide-react';

// Each status has its own icon as well as its colour, and its words say it all on their own.
export const PACK_STATUS_LOOKS: Record<
  PackSummary['status'],
  { icon: LucideIcon; colour: string }
> = {
  valid: { icon: ShieldCheck, colour: 'text-normal' },
  superseded: { icon: History, colour: 'text-info' },
  revoked: { icon: Ban, colour: 'text-alarm' },
};
