/**
 * The lowest number from 1 up that none of `numbers` uses: the slot or area number to suggest
 * next. Values that are not numbers (a field still being typed) are ignored.
 */
export function lowestFreeNumber(numbers: readonly unknown[]): number {
  const used = new Set(numbers.filter((value): value is number => typeof value === 'number'));
  let candidate = 1;
  while (used.has(candidate)) candidate += 1;
  return candidate;
}
