/**
 * Units a quantity may carry, grouped into families so that "90 seconds" and "1.5 minutes"
 * compare as the same amount. `factor` converts to the family's base unit.
 */
export interface Unit {
  family: 'time' | 'length' | 'mass' | 'volume' | 'temperature' | 'percent' | 'money' | 'count';
  base: string;
  factor: number;
}

const table: [string[], Unit][] = [
  [['second', 'seconds', 'sec', 'secs', 's'], { family: 'time', base: 'second', factor: 1 }],
  [['minute', 'minutes', 'min', 'mins'], { family: 'time', base: 'second', factor: 60 }],
  [['hour', 'hours', 'hr', 'hrs', 'h'], { family: 'time', base: 'second', factor: 3600 }],
  [['day', 'days'], { family: 'time', base: 'second', factor: 86400 }],
  [['week', 'weeks'], { family: 'time', base: 'second', factor: 604800 }],
  [['millimetre', 'millimetres', 'millimeter', 'millimeters', 'mm'], { family: 'length', base: 'metre', factor: 0.001 }],
  [['centimetre', 'centimetres', 'centimeter', 'centimeters', 'cm'], { family: 'length', base: 'metre', factor: 0.01 }],
  [['metre', 'metres', 'meter', 'meters', 'm'], { family: 'length', base: 'metre', factor: 1 }],
  [['kilometre', 'kilometres', 'kilometer', 'kilometers', 'km'], { family: 'length', base: 'metre', factor: 1000 }],
  [['foot', 'feet', 'ft'], { family: 'length', base: 'metre', factor: 0.3048 }],
  [['yard', 'yards', 'yd'], { family: 'length', base: 'metre', factor: 0.9144 }],
  [['mile', 'miles', 'mi'], { family: 'length', base: 'metre', factor: 1609.344 }],
  [['gram', 'grams', 'g'], { family: 'mass', base: 'gram', factor: 1 }],
  [['kilogram', 'kilograms', 'kg'], { family: 'mass', base: 'gram', factor: 1000 }],
  [['ounce', 'ounces', 'oz'], { family: 'mass', base: 'gram', factor: 28.349523125 }],
  [['pound', 'pounds', 'lb', 'lbs'], { family: 'mass', base: 'gram', factor: 453.59237 }],
  [['millilitre', 'millilitres', 'milliliter', 'milliliters', 'ml'], { family: 'volume', base: 'litre', factor: 0.001 }],
  [['litre', 'litres', 'liter', 'liters', 'l'], { family: 'volume', base: 'litre', factor: 1 }],
  [['degree', 'degrees', '°', '°c', '°f'], { family: 'temperature', base: 'degree', factor: 1 }],
  [['percent', 'per cent', '%'], { family: 'percent', base: 'percent', factor: 1 }],
  [['dollar', 'dollars', '$', 'euro', 'euros', '€', 'pound sterling', '£'], { family: 'money', base: 'currency', factor: 1 }],
];

export const UNITS: ReadonlyMap<string, Unit> = new Map(table.flatMap(([names, unit]) => names.map((n) => [n, unit] as const)));
