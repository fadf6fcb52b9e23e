/** Whether a unit says anything ("-" and "" mark a dimensionless quantity). */
function shown(unit?: string): unit is string {
  return unit !== undefined && unit.trim() !== '' && unit.trim() !== '-';
}

/** A name with its unit for axis titles and table headers: "T (K)", "Da (-)" for a declared dimensionless one, or just "T". */
export function withUnit(name: string, unit?: string): string {
  return unit === undefined || unit === '' ? name : `${name} (${unit})`;
}

/** A value with its unit after it: "350 K"; nothing added for a dimensionless or unitless value. */
export function valueWithUnit(value: string, unit?: string): string {
  return shown(unit) ? `${value} ${unit}` : value;
}
