const byteUnits = ['bytes', 'KB', 'MB', 'GB'] as const;

/** File sizes in binary units, as operating systems show them ("15 MB" is 15 × 1024 × 1024). */
export function formatFileSize(bytes: number): string {
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < byteUnits.length - 1) {
    value /= 1024;
    unit += 1;
  }
  const rounded = unit === 0 ? String(value) : value.toFixed(value < 10 ? 1 : 0);
  return `${rounded} ${byteUnits[unit]}`;
}
