import { HomeownerHome } from '@/features/homes/components/homeowner-home';

export function HomeownerHomeRoute() {
  return (
    <>
      <title>My home · Wardbook</title>
      <HomeownerHome />
    </>
  );
}
