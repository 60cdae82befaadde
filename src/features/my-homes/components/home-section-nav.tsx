import { NavLink } from 'react-router-dom';

import { paths, type MyHomeSection } from '@/config/paths';
import { cn } from '@/utils/cn';

const sections: ReadonlyArray<{ label: string; section?: MyHomeSection }> = [
  { label: 'Overview' },
  { label: 'Zones', section: 'zones' },
  { label: 'Keyholders', section: 'keyholders' },
  { label: 'User codes', section: 'user-codes' },
  { label: 'Files', section: 'files' },
  { label: 'Signal history', section: 'signals' },
  { label: 'Service history', section: 'service' },
  { label: 'Request a change', section: 'request' },
];

/**
 * The pages of one home as a grid of large links, so all of them fit a phone screen without
 * sideways scrolling; the current one is marked by aria-current and a brass bar, not colour alone.
 */
export function HomeSectionNav({ siteId, homeName }: { siteId: string; homeName: string }) {
  return (
    <nav aria-label={`Sections of ${homeName}`}>
      <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3">
        {sections.map(({ label, section }) => (
          <li key={label}>
            <NavLink
              to={paths.myHome.getHref(siteId, section)}
              end={!section}
              className={({ isActive }) =>
                cn(
                  'flex min-h-12 items-center rounded-md border px-3 font-semibold no-underline',
                  isActive
                    ? 'border-ink border-l-8 border-l-brass bg-white text-ink'
                    : 'border-hairline bg-white text-ink-muted hover:border-ink hover:text-ink',
                )
              }
            >
              {label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
