// Units of the trade, named by their UCUM codes (the Unified Code for Units of Measure, an open
// standard), with exact factors. Every factor below is built from the exact definitions that
// NIST SP 811 (2008 ed.), Appendix B.8/B.9, rests on, so no rounded table value creeps in:
// international inch 0.0254 m and foot 0.3048 m, avoirdupois pound 0.453 592 37 kg, standard
// gravity 9.806 65 m/s², mile 1609.344 m; US gallon 231 in³ (NIST Handbook 44, App. C); imperial
// gallon 4.546 09 L (UK Weights and Measures Act 1985).
import { describe, finite } from './guard';

export type Dimension = 'torque' | 'volume' | 'pressure' | 'length' | 'temperature' | 'electric potential';

const INCH_M = 0.0254;
const FOOT_M = 0.3048;
const POUND_KG = 0.45359237;
const STANDARD_GRAVITY = 9.80665;
const POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY; // 4.448 221 615 260 5 N
const US_GALLON_L = 231 * (INCH_M * 10) ** 3; // 231 in³ in dm³ = 3.785 411 784 L
const IMPERIAL_GALLON_L = 4.54609;

type LinearUnit = { code: string; dimension: Exclude<Dimension, 'temperature'>; label: string; perBase: number };
type TemperatureUnit = { code: string; dimension: 'temperature'; label: string; toCelsius: (v: number) => number; fromCelsius: (c: number) => number };
export type UnitDefinition = LinearUnit | TemperatureUnit;

// `perBase`: how many base units (N.m, L, kPa, mm, V) one of this unit is.
const LINEAR: LinearUnit[] = [
  { code: 'N.m', dimension: 'torque', label: 'N·m', perBase: 1 },
  { code: '[lbf_av].[ft_i]', dimension: 'torque', label: 'lbf·ft', perBase: POUND_FORCE_N * FOOT_M },
  { code: '[lbf_av].[in_i]', dimension: 'torque', label: 'lbf·in', perBase: POUND_FORCE_N * INCH_M },
  { code: 'kgf.m', dimension: 'torque', label: 'kgf·m', perBase: STANDARD_GRAVITY },
  { code: 'L', dimension: 'volume', label: 'L', perBase: 1 },
  { code: 'mL', dimension: 'volume', label: 'mL', perBase: 0.001 },
  { code: '[qt_us]', dimension: 'volume', label: 'US qt', perBase: US_GALLON_L / 4 },
  { code: '[pt_us]', dimension: 'volume', label: 'US pt', perBase: US_GALLON_L / 8 },
  { code: '[gal_us]', dimension: 'volume', label: 'US gal', perBase: US_GALLON_L },
  { code: '[pt_br]', dimension: 'volume', label: 'imp pt', perBase: IMPERIAL_GALLON_L / 8 },
  { code: '[qt_br]', dimension: 'volume', label: 'imp qt', perBase: IMPERIAL_GALLON_L / 4 },
  { code: '[gal_br]', dimension: 'volume', label: 'imp gal', perBase: IMPERIAL_GALLON_L },
  { code: 'kPa', dimension: 'pressure', label: 'kPa', perBase: 1 },
  { code: 'Pa', dimension: 'pressure', label: 'Pa', perBase: 0.001 },
  { code: 'MPa', dimension: 'pressure', label: 'MPa', perBase: 1000 },
  { code: 'bar', dimension: 'pressure', label: 'bar', perBase: 100 },
  { code: 'mbar', dimension: 'pressure', label: 'mbar', perBase: 0.1 },
  { code: '[psi]', dimension: 'pressure', label: 'psi', perBase: POUND_FORCE_N / (INCH_M * INCH_M) / 1000 },
  { code: 'mm', dimension: 'length', label: 'mm', perBase: 1 },
  { code: 'cm', dimension: 'length', label: 'cm', perBase: 10 },
  { code: 'm', dimension: 'length', label: 'm', perBase: 1000 },
  { code: 'km', dimension: 'length', label: 'km', perBase: 1_000_000 },
  { code: '[in_i]', dimension: 'length', label: 'in', perBase: INCH_M * 1000 },
  { code: '[ft_i]', dimension: 'length', label: 'ft', perBase: FOOT_M * 1000 },
  { code: '[mi_i]', dimension: 'length', label: 'mi', perBase: 1_609_344 },
  { code: 'V', dimension: 'electric potential', label: 'V', perBase: 1 },
  { code: 'mV', dimension: 'electric potential', label: 'mV', perBase: 0.001 },
];

// Temperatures have an offset, so they convert through degrees Celsius with the exact relations
// of NIST SP 811 B.9 (t/°C = T/K − 273.15; t/°F = 1.8 t/°C + 32) rather than through a factor.
const TEMPERATURE: TemperatureUnit[] = [
  { code: 'Cel', dimension: 'temperature', label: '°C', toCelsius: (v) => v, fromCelsius: (c) => c },
  { code: 'K', dimension: 'temperature', label: 'K', toCelsius: (v) => v - 273.15, fromCelsius: (c) => c + 273.15 },
  { code: '[degF]', dimension: 'temperature', label: '°F', toCelsius: (v) => ((v - 32) * 5) / 9, fromCelsius: (c) => (c * 9) / 5 + 32 },
];

// Other spellings UCUM itself accepts for the same unit (a product may be written either way round).
const ALIASES: Record<string, string> = {
  '[ft_i].[lbf_av]': '[lbf_av].[ft_i]',
  '[in_i].[lbf_av]': '[lbf_av].[in_i]',
  'm.kgf': 'kgf.m',
  l: 'L',
  ml: 'mL',
};

const BY_CODE = new Map<string, UnitDefinition>([...LINEAR, ...TEMPERATURE].map((u) => [u.code, u]));

/** Every unit the calculators know, in display order. */
export const UNITS: readonly UnitDefinition[] = [...LINEAR, ...TEMPERATURE];

export function unitsOf(dimension: Dimension): UnitDefinition[] {
  return UNITS.filter((u) => u.dimension === dimension);
}

/** The definition of a UCUM code, or an Error listing what is known. */
export function unit(code: string): UnitDefinition {
  const found = typeof code === 'string' ? BY_CODE.get(ALIASES[code] ?? code) : undefined;
  if (!found) {
    throw new Error(`${describe(code)} is not a unit Tickover knows; use a UCUM code such as ${[...BY_CODE.keys()].join(', ')}`);
  }
  return found;
}

export function isKnownUnit(code: string): boolean {
  return BY_CODE.has(ALIASES[code] ?? code);
}

export function sameDimension(a: string, b: string): boolean {
  return isKnownUnit(a) && isKnownUnit(b) && unit(a).dimension === unit(b).dimension;
}

/** `value` in `fromUnit` expressed in `toUnit`; throws on an unknown code or on units of different kinds. */
export function convert(value: number, fromUnit: string, toUnit: string): number {
  const v = finite('The value to convert', value);
  const from = unit(fromUnit);
  const to = unit(toUnit);
  if (from.dimension !== to.dimension) {
    throw new Error(`Cannot convert ${from.label} (${from.dimension}) to ${to.label} (${to.dimension})`);
  }
  if (from.code === to.code) return v;
  if (from.dimension === 'temperature' && to.dimension === 'temperature') {
    return to.fromCelsius(from.toCelsius(v));
  }
  const f = from as LinearUnit;
  const t = to as LinearUnit;
  // Multiply first: with whole-number factors (mi = 1 609 344 mm) the product is exact and only
  // the division rounds, so 10 000 mi comes out as the double nearest 16 093.44 km.
  return (v * f.perBase) / t.perBase;
}
