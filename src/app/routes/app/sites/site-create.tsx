import { PageHeading } from '@/components/ui/page-heading';
import { CreateSiteForm } from '@/features/sites/components/create-site-form';
import { useSiteRole } from '@/features/sites/utils/use-site-role';

export function Component() {
  const role = useSiteRole();
  return (
    <>
      <title>New site · Wardbook</title>
      <PageHeading title="New site">
        <p>
          Record the premises as surveyed. The control panel, zones and devices are added from the
          site&rsquo;s own pages once it is saved.
        </p>
      </PageHeading>
      <CreateSiteForm role={role} />
    </>
  );
}
