import { OperatorHome } from '@/features/homes/components/operator-home';

export function OperatorHomeRoute() {
  return (
    <>
      <title>Operator home · Wardbook</title>
      <OperatorHome />
    </>
  );
}
