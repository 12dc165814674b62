/**
 * Physical constants used by the calculation engine, with their sources.
 *
 * - `gasConstant`: molar gas constant R = 8.31446261815324 J mol^-1 K^-1, exact (CODATA 2018;
 *   R = N_A k with both exact since the 2019 SI).
 * - `molarVolumeAt273K101kPa`: ideal-gas molar volume at 273.15 K and 101.325 kPa,
 *   22.41396954 dm^3 mol^-1 (CODATA 2018, exact to the digits shown).
 * - `schoolMolarVolume`: 24.0 dm^3 mol^-1 at room temperature and pressure, a school convention
 *   (common practice; not an exact value: the ideal-gas value at 20 C and 1 atm is 24.055).
 * - `zeroCelsiusInKelvin`: 273.15 (exact, definition of the Celsius scale).
 * - `hydrogenPeroxideMolarMass`: 34.0147 g mol^-1, from 2 x 1.00794 + 2 x 15.9994 (IUPAC 2007
 *   standard atomic weights of H and O, from memory).
 *
 * @example
 * physicalConstants.gasConstant; // => 8.31446261815324
 */
export const physicalConstants = {
  gasConstant: 8.31446261815324,
  molarVolumeAt273K101kPa: 22.41396954,
  schoolMolarVolume: 24.0,
  zeroCelsiusInKelvin: 273.15,
  hydrogenPeroxideMolarMass: 34.0147,
} as const;
