import type { ReactNode } from 'react';
import { Download, ShieldCheck } from 'lucide-react';
import { Link } from 'react-router-dom';

import type { PackSummary } from '@server/handover/schema';
import { buttonClassName, type ButtonVariant } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';

type PackLinksProps = {
  pack: PackSummary;
  /** Brass for the one a homeowner should open; otherwise white. */
  downloadVariant?: ButtonVariant;
  /** More actions on the pack, after the links (e.g. Revoke). */
  children?: ReactNode;
};

/** "Download pack …" and "Verify pack …" for one issued pack, as large targets. */
export function PackLinks({ pack, downloadVariant = 'secondary', children }: PackLinksProps) {
  return (
    <div className="flex flex-wrap gap-2">
      <a
        href={pack.downloadUrl}
        download
        className={buttonClassName({ variant: downloadVariant, size: 'lg' })}
      >
        <Download aria-hidden="true" className="size-5" />
        Download <span className="sr-only">pack {pack.packNumber}</span>
      </a>
      <Link
        to={paths.verify.pack.getHref(pack.packNumber)}
        className={buttonClassName({ variant: 'secondary', size: 'lg' })}
      >
        <ShieldCheck aria-hidden="true" className="size-5" />
        Verify <span className="sr-only">pack {pack.packNumber}</span>
      </Link>
      {children}
    </div>
  );
}
