import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { HomeOverview } from '@/features/my-homes/components/home-overview';
import { ServicePlanCard } from '@/features/service/components/service-plan-card';
import { useSiteIdParam } from '@/lib/site-id-param';

// The frame's loader has already fetched the home; the service plan loads on its own, so the
// home opens even if the plan cannot be had.
export function Component() {
  const { data: home } = useMyHome(useSiteIdParam());
  return (
    <>
      <title>{`${home.name} · Wardbook`}</title>
      <div className="grid gap-5">
        <HomeOverview home={home} />
        <ServicePlanCard siteId={home.id} audience="homeowner" />
      </div>
    </>
  );
}
