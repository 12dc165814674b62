import { MarkingInputError } from "./marking-input-error";
import { unitTable, type Dimensions } from "./internal/unit-table";

/** A parsed unit: how to reach SI base units, what it measures, and how to print it. */
export interface ParsedUnit {
  /** SI value = typed value x factor (+ offset for a bare Celsius temperature). */
  readonly factor: number;
  /** factor = multiplier x 10^powerOfTen; kept apart so that decimal prefixes convert exactly. */
  readonly powerOfTen: number;
  readonly multiplier: number;
  /** Exponents of [length, mass, time, amount, temperature, current]. */
  readonly dimensions: Dimensions;
  /** 273.15 for a bare "°C", 0 otherwise. */
  readonly offset: number;
  /** True when the unit is a bare temperature (K or °C), where the Celsius offset applies. */
  readonly isTemperatureScale: boolean;
  /** Tidy form, for example "cm³ s⁻¹" (empty for a pure number). */
  readonly display: string;
}

const superscripts: Record<string, string> = {
  "⁰": "0", "¹": "1", "²": "2", "³": "3", "⁴": "4", "⁵": "5", "⁶": "6", "⁷": "7", "⁸": "8", "⁹": "9", "⁻": "-", "⁺": "+",
};
const toSuperscript: Record<string, string> = Object.fromEntries(Object.entries(superscripts).map(([sup, plain]) => [plain, sup]));

interface Factor {
  readonly parts: readonly (readonly [string, number])[];
  readonly power: number;
  readonly powerOfTen: number;
  readonly multiplier: number;
  readonly dimensions: Dimensions;
  readonly offset: number;
}

function normalise(text: string): string {
  let result = text.trim();
  result = result.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (run) => `^${[...run].map((character) => superscripts[character]).join("")}`);
  result = result.replace(/[\u2212\u2013]/g, "-");
  result = result.replace(/\*\*/g, "^");
  result = result.replace(/deg(?:rees?)?\s*C\b/gi, "degC").replace(/°\s*C/g, "°C").replace(/\bdeg(?:rees?)?\s*K\b/gi, "K");
  result = result.replace(/\bper\b/gi, "/");
  result = result.replace(/[·⋅×*]/g, " ");
  result = result.replace(/([A-Za-zµμΩ%])\.(?=[A-Za-zµμΩ(])/g, "$1 ");
  return result;
}

function describe(display: string, power: number): string {
  if (power === 1) return display;
  return `${display}${[...String(power)].map((character) => toSuperscript[character] ?? character).join("")}`;
}

/**
 * Reads a unit as students type it and says what it measures.
 *
 * Accepts plain and superscript powers ("cm3", "cm^3", "cm³", "s-1", "s^-1", "s⁻¹"), products
 * separated by spaces, dots or "·" ("mol dm-3", "cm³ s⁻¹"), division by "/" or "per" ("cm3/s",
 * "/s", "mol/dm3/s"; everything after a "/" is in the denominator, so "J/mol K" means J mol⁻¹ K⁻¹),
 * brackets ("J/(mol K)"), "M" for mol dm⁻³, and "°C", "C", "oC" or "degC" for degrees Celsius.
 * Units are case-sensitive where it matters (M molar, m metre).
 *
 * @param text - the typed unit; empty for a pure number
 * @returns factor to SI base units, dimensions, Celsius offset and a tidy display form
 * @throws {MarkingInputError} `unknown-unit` when a part is not recognised
 * @example
 * parseUnit("cm3 s-1").display; // => "cm³ s⁻¹"
 * parseUnit("M").factor; // => 1000 (mol m^-3 per mol dm^-3)
 */
export function parseUnit(text: string): ParsedUnit {
  if (typeof text !== "string") {
    throw new MarkingInputError("unknown-unit", "parseUnit", "The unit must be typed as text, for example cm3/s.");
  }
  const cached = parsedUnits.get(text);
  if (cached) return cached;
  const parsed = Object.freeze(parseUnitText(text));
  if (parsedUnits.size >= 512) parsedUnits.clear();
  parsedUnits.set(text, parsed);
  return parsed;
}

// Units repeat endlessly across a class's write-ups, so parsed units are remembered (the result
// depends only on the text, so this changes nothing but speed).
const parsedUnits = new Map<string, ParsedUnit>();

function parseUnitText(text: string): ParsedUnit {
  const source = normalise(text);
  const tokens = source.match(/\/|[A-Za-zµμΩ°℃%]+(?:\^\s*\(\s*[-+]?\d+\s*\)|\^?\s*[-+]?\d+)?|\^\s*\(\s*[-+]?\d+\s*\)|\^?[-+]?\d+|\(|\)|\S/g) ?? [];
  let position = 0;
  const unknown = (part: string): MarkingInputError =>
    new MarkingInputError(
      "unknown-unit",
      "parseUnit",
      `The unit "${text}" was not recognised (the part "${part}"); write it like cm3/s, mol dm-3 or °C.`,
    );

  const parseSequence = (): Factor[] => {
    const factors: Factor[] = [];
    let inDenominator = false;
    while (position < tokens.length) {
      const token = tokens[position];
      if (token === ")") break;
      position += 1;
      if (token === "/") {
        inDenominator = true;
        continue;
      }
      let group: Factor[];
      if (token === "(") {
        group = parseSequence();
        if (tokens[position] !== ")") throw unknown("(");
        position += 1;
        const exponent = /^\^?\s*\(?\s*([-+]?\d+)\s*\)?$/.exec(tokens[position] ?? "");
        if (exponent) {
          position += 1;
          const power = Number(exponent[1]);
          group = group.map((factor) => ({ ...factor, power: factor.power * power }));
        }
      } else {
        const match = /^([A-Za-zµμΩ°℃%]+)(?:\^?\s*\(?\s*([-+]?\d+)\s*\)?)?$/.exec(token);
        if (!match) throw unknown(token);
        const definition = unitTable.get(match[1]);
        if (!definition) throw unknown(match[1]);
        const power = match[2] === undefined ? 1 : Number(match[2]);
        if (power === 0) throw unknown(token);
        group = [
          {
            parts: definition.parts,
            power,
            powerOfTen: definition.powerOfTen,
            multiplier: definition.multiplier,
            dimensions: definition.dimensions,
            offset: definition.offset ?? 0,
          },
        ];
      }
      for (const factor of group) factors.push(inDenominator ? { ...factor, power: -factor.power } : factor);
    }
    return factors;
  };

  const factors = parseSequence();
  if (position < tokens.length) throw unknown(tokens[position]);
  let powerOfTen = 0;
  let multiplier = 1;
  const dimensions = [0, 0, 0, 0, 0, 0];
  for (const part of factors) {
    powerOfTen += part.powerOfTen * part.power;
    multiplier *= part.multiplier ** part.power;
    part.dimensions.forEach((exponent, i) => {
      dimensions[i] += exponent * part.power;
    });
  }
  const isTemperatureScale = factors.length === 1 && factors[0].power === 1 && factors[0].dimensions[4] === 1;
  // Combine repeated symbols (for example "cm3 cm-1") before printing.
  const powers = new Map<string, number>();
  for (const part of factors) {
    for (const [symbol, symbolPower] of part.parts) powers.set(symbol, (powers.get(symbol) ?? 0) + symbolPower * part.power);
  }
  const display = [...powers.entries()]
    .filter(([, power]) => power !== 0)
    .sort((a, b) => (b[1] > 0 ? 1 : 0) - (a[1] > 0 ? 1 : 0))
    .map(([symbol, power]) => describe(symbol, power))
    .join(" ");
  return {
    factor: powerOfTen >= 0 ? multiplier * Number(`1e${powerOfTen}`) : multiplier / Number(`1e${-powerOfTen}`),
    powerOfTen,
    multiplier,
    dimensions: dimensions as unknown as Dimensions,
    offset: isTemperatureScale ? factors[0].offset : 0,
    isTemperatureScale,
    display,
  };
}
