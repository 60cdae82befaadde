import type { SiteDetail } from '@server/sites/schema';
import { SectionTabs, type SectionTab } from '@/components/ui/section-tabs';
import { paths, type SiteRole } from '@/config/paths';

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

export function SiteSectionTabs({ role, site }: { role: SiteRole; site: SiteDetail }) {
  const href = (section?: Parameters<typeof paths.sites.workspace.getHref>[2]) =>
    paths.sites.workspace.getHref(role, site.id, section);
  const { counts } = site;
  const tabs: SectionTab[] = [
    { label: 'Overview', href: href(), end: true },
    { label: 'System', href: href('system') },
    {
      label: 'Zones',
      href: href('zones'),
      count: counts.zones,
      countLabel: plural(counts.zones, 'zone', 'zones'),
    },
    {
      label: 'Devices',
      href: href('devices'),
      count: counts.devices,
      countLabel: plural(counts.devices, 'device', 'devices'),
    },
    {
      label: 'People',
      href: href('people'),
      count: counts.keyholders,
      countLabel: plural(counts.keyholders, 'keyholder', 'keyholders'),
    },
    {
      label: 'Files',
      href: href('files'),
      count: counts.files,
      countLabel: plural(counts.files, 'file', 'files'),
    },
    { label: 'Commissioning', href: href('commissioning') },
    { label: 'Handover', href: href('handover') },
  ];
  return <SectionTabs label="Site sections" tabs={tabs} />;
}
