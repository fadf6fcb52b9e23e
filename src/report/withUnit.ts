/** A name with its unit for axis titles and table headers: "T (K)", or just "T". */
export function withUnit(name: string, unit?: string): string {
  return unit === undefined || unit === '' ? name : `${name} (${unit})`;
}
