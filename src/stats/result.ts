/**
 * A statistic that may be undefined for the data: a number, or null with the reason. Outputs
 * never carry NaN or Infinity.
 */
export type Estimate = { value: number; reason?: undefined } | { value: null; reason: string };

export const defined = (value: number): Estimate => (Number.isFinite(value) ? { value } : { value: null, reason: 'not defined for these data' });
export const undefinedBecause = (reason: string): Estimate => ({ value: null, reason });
