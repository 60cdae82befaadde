import { OfficeHome } from '@/features/homes/components/office-home';

export function OfficeHomeRoute() {
  return (
    <>
      <title>Office home · Wardbook</title>
      <OfficeHome />
    </>
  );
}
