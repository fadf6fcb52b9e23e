/** The caution every report carries, near its top and at its end. */
export const CAUTION =
  'These results come from a model, not from the plant: verify them against plant or laboratory data before ' +
  'relying on them. Where safety is involved (reactor runaway, voltage collapse, structural loads), defer to ' +
  'local codes, standards and licensed engineers.';
