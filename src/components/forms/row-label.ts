/**
 * The name a screen reader hears for a field that repeats on every row of a list editor
 * ("Location, row 3"). It starts with the visible label, so speech users can say what they see.
 */
export const labelInRow = (label: string, row: number) => `${label}, row ${row}`;
