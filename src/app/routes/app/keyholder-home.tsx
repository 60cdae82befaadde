import { KeyholderHome } from '@/features/homes/components/keyholder-home';

export function KeyholderHomeRoute() {
  return (
    <>
      <title>Keyholder home · Wardbook</title>
      <KeyholderHome />
    </>
  );
}
