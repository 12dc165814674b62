/**
 * The units the engine understands. Dimensions are exponents of
 * [length, mass, time, amount, temperature, current]; factor converts to the SI base units
 * (m, kg, s, mol, K, A). Prefixed forms are listed explicitly: students type a small set.
 */
export type Dimensions = readonly [number, number, number, number, number, number];

export interface UnitDefinition {
  /** How the unit is printed back, as symbols with powers (L prints as dm³). */
  readonly parts: readonly (readonly [string, number])[];
  /** The factor to SI is multiplier x 10^powerOfTen, kept apart so decimal prefixes convert exactly. */
  readonly powerOfTen: number;
  readonly multiplier: number;
  readonly dimensions: Dimensions;
  /** For the Celsius scale: value in K = value in C + offset (only for a bare temperature). */
  readonly offset?: number;
}

const length: Dimensions = [1, 0, 0, 0, 0, 0];
const mass: Dimensions = [0, 1, 0, 0, 0, 0];
const time: Dimensions = [0, 0, 1, 0, 0, 0];
const amount: Dimensions = [0, 0, 0, 1, 0, 0];
const temperature: Dimensions = [0, 0, 0, 0, 1, 0];
const current: Dimensions = [0, 0, 0, 0, 0, 1];
const none: Dimensions = [0, 0, 0, 0, 0, 0];
const volume: Dimensions = [3, 0, 0, 0, 0, 0];
const concentration: Dimensions = [-3, 0, 0, 1, 0, 0];
const energy: Dimensions = [2, 1, -2, 0, 0, 0];
const force: Dimensions = [1, 1, -2, 0, 0, 0];
const pressure: Dimensions = [-1, 1, -2, 0, 0, 0];
const power: Dimensions = [2, 1, -3, 0, 0, 0];
const voltage: Dimensions = [2, 1, -3, 0, 0, -1];
const resistance: Dimensions = [2, 1, -3, 0, 0, -2];

function unit(
  display: string | (readonly [string, number])[],
  powerOfTen: number,
  dimensions: Dimensions,
  offset?: number,
  multiplier = 1,
): UnitDefinition {
  const parts: (readonly [string, number])[] = typeof display === "string" ? [[display, 1]] : display;
  return offset === undefined ? { parts, powerOfTen, multiplier, dimensions } : { parts, powerOfTen, multiplier, dimensions, offset };
}

const definitions: [string[], UnitDefinition][] = [
  [["m", "metre", "metres", "meter", "meters"], unit("m", 0, length)],
  [["km"], unit("km", 3, length)],
  [["dm"], unit("dm", -1, length)],
  [["cm"], unit("cm", -2, length)],
  [["mm"], unit("mm", -3, length)],
  [["µm", "μm", "um"], unit("µm", -6, length)],
  [["nm"], unit("nm", -9, length)],
  [["L", "l", "litre", "litres", "liter", "liters"], unit([["dm", 3]], -3, volume)],
  [["mL", "ml", "cc"], unit([["cm", 3]], -6, volume)],
  [["µL", "μL", "uL", "µl", "ul"], unit([["mm", 3]], -9, volume)],
  [["kg"], unit("kg", 0, mass)],
  [["g", "gram", "grams"], unit("g", -3, mass)],
  [["mg"], unit("mg", -6, mass)],
  [["µg", "μg", "ug"], unit("µg", -9, mass)],
  [["s", "sec", "secs", "second", "seconds"], unit("s", 0, time)],
  [["ms"], unit("ms", -3, time)],
  [["min", "mins", "minute", "minutes"], unit("min", 0, time, undefined, 60)],
  [["h", "hr", "hrs", "hour", "hours"], unit("h", 0, time, undefined, 3600)],
  [["d", "day", "days"], unit("d", 0, time, undefined, 86400)],
  [["mol", "mole", "moles"], unit("mol", 0, amount)],
  [["mmol"], unit("mmol", -3, amount)],
  [["µmol", "μmol", "umol"], unit("µmol", -6, amount)],
  [["M", "molar"], unit([["mol", 1], ["dm", -3]], 3, concentration)],
  [["mM"], unit([["mmol", 1], ["dm", -3]], 0, concentration)],
  [["K", "kelvin"], unit("K", 0, temperature, 0)],
  [["°C", "℃", "degC", "C", "oC", "celsius"], unit("°C", 0, temperature, 273.15)],
  [["J", "joule", "joules"], unit("J", 0, energy)],
  [["kJ"], unit("kJ", 3, energy)],
  [["MJ"], unit("MJ", 6, energy)],
  [["N"], unit("N", 0, force)],
  [["Pa"], unit("Pa", 0, pressure)],
  [["kPa"], unit("kPa", 3, pressure)],
  [["W"], unit("W", 0, power)],
  [["V", "volt", "volts"], unit("V", 0, voltage)],
  [["mV"], unit("mV", -3, voltage)],
  [["A", "amp", "amps"], unit("A", 0, current)],
  [["mA"], unit("mA", -3, current)],
  [["Ω", "Ω", "ohm", "ohms"], unit("Ω", 0, resistance)],
  [["%", "percent"], unit("%", -2, none)],
];

export const unitTable: ReadonlyMap<string, UnitDefinition> = new Map(
  definitions.flatMap(([symbols, definition]) => symbols.map((symbol) => [symbol, definition] as const)),
);
