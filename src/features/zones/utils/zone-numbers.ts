const HIGHEST_ZONE_NUMBER = 999;

/**
 * The first zone number above `after` that no row uses yet, wrapping round to the lowest free
 * number if the top of the range is full. Rows whose number is still being typed are ignored.
 */
export function nextFreeZoneNumber(numbers: readonly unknown[], after: number): number {
  const used = new Set(
    numbers.filter(
      (value): value is number => typeof value === 'number' && Number.isInteger(value),
    ),
  );
  for (let candidate = Math.max(1, after + 1); candidate <= HIGHEST_ZONE_NUMBER; candidate += 1) {
    if (!used.has(candidate)) return candidate;
  }
  for (let candidate = 1; candidate <= HIGHEST_ZONE_NUMBER; candidate += 1) {
    if (!used.has(candidate)) return candidate;
  }
  return HIGHEST_ZONE_NUMBER;
}
