import { EngineerHome } from '@/features/homes/components/engineer-home';

export function EngineerHomeRoute() {
  return (
    <>
      <title>Engineer home · Wardbook</title>
      <EngineerHome />
    </>
  );
}
