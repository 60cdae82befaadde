import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { HomeOverview } from '@/features/my-homes/components/home-overview';
import { useSiteIdParam } from '@/lib/site-id-param';

// The frame's loader has already fetched the home; nothing more to wait for.
export function Component() {
  const { data: home } = useMyHome(useSiteIdParam());
  return (
    <>
      <title>{`${home.name} · Wardbook`}</title>
      <HomeOverview home={home} />
    </>
  );
}
