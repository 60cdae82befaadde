/** How a row is named in its buttons: by its zone number, or by its row while that is blank. */
export function zoneRowName(number: unknown, row: number): string {
  return typeof number === 'number' && Number.isInteger(number)
    ? `zone ${number}`
    : `the zone in row ${row}`;
}

/** What a zone row's ids start with: "zone-<key>-heading" (see `editableRowIds`). */
export const ZONE_ROW_KIND = 'zone';

/** The same name at the start of a sentence, for announcements. */
export function zoneRowSentenceName(number: unknown, row: number): string {
  const name = zoneRowName(number, row);
  return name.charAt(0).toUpperCase() + name.slice(1);
}
