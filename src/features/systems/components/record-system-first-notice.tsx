import { Link } from 'react-router-dom';

import { Notice } from '@/components/ui/notice';
import { paths, type SiteRole } from '@/config/paths';

type RecordSystemFirstNoticeProps = {
  role: SiteRole;
  siteId: string;
  /** What cannot be recorded yet, as the start of a sentence: "Zones", "Devices". */
  records: string;
};

/** Shown in place of a section that hangs on the system, until the control panel is recorded. */
export function RecordSystemFirstNotice({ role, siteId, records }: RecordSystemFirstNoticeProps) {
  return (
    <Notice tone="info" title="Record the control panel on the System tab first">
      <p>
        {records} belong to a system and its areas.{' '}
        <Link
          to={paths.sites.workspace.getHref(role, siteId, 'system')}
          className="font-semibold text-ink"
        >
          Go to the System tab
        </Link>
      </p>
    </Notice>
  );
}
