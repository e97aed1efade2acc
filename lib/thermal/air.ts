/**
 * Dry air at atmospheric pressure, properties at the film temperature by linear interpolation
 * (physics.md §2).
 *
 * Values: Incropera, DeWitt, Bergman & Lavine, *Fundamentals of Heat and Mass Transfer*,
 * Table A.4 — FROM MEMORY, not read from the book at hand. The 300 K and 350 K rows are the ones
 * quoted in references.md; the 250–1000 K rows agree with two independent public transcriptions
 * of the table that were looked at while writing this, the 200 K row does not have that check.
 * Columns: T (K), k (W/(m·K)), ν (m²/s), Pr.
 */
export const AIR_TABLE_FROM_MEMORY: ReadonlyArray<readonly [number, number, number, number]> = [
  [200, 18.1e-3, 7.59e-6, 0.737],
  [250, 22.3e-3, 11.44e-6, 0.72],
  [300, 26.3e-3, 15.89e-6, 0.707],
  [350, 30.0e-3, 20.92e-6, 0.7],
  [400, 33.8e-3, 26.41e-6, 0.69],
  [450, 37.3e-3, 32.39e-6, 0.686],
  [500, 40.7e-3, 38.79e-6, 0.684],
  [550, 43.9e-3, 45.57e-6, 0.683],
  [600, 46.9e-3, 52.69e-6, 0.685],
  [650, 49.7e-3, 60.21e-6, 0.69],
  [700, 52.4e-3, 68.1e-6, 0.695],
  [750, 54.9e-3, 76.37e-6, 0.702],
  [800, 57.3e-3, 84.93e-6, 0.709],
  [850, 59.6e-3, 93.8e-6, 0.716],
  [900, 62.0e-3, 102.9e-6, 0.72],
  [950, 64.3e-3, 112.2e-6, 0.723],
  [1000, 66.7e-3, 121.9e-6, 0.726],
];

export interface AirProperties {
  temperatureK: number;
  /** W/(m·K) */
  conductivity: number;
  /** m²/s */
  kinematicViscosity: number;
  /** m²/s, ν/Pr */
  thermalDiffusivity: number;
  prandtl: number;
  /** 1/K, ideal gas: 1/T */
  expansion: number;
  /** False when T lies outside the table; the properties are then those of the nearest end. */
  inTable: boolean;
}

export function airProperties(temperatureK: number): AirProperties {
  const table = AIR_TABLE_FROM_MEMORY;
  const first = table[0][0];
  const last = table[table.length - 1][0];
  const inTable = temperatureK >= first && temperatureK <= last;
  // Clamp rather than extrapolate: outside the table the caller gets a flag, not a guess.
  const t = Math.min(Math.max(temperatureK, first), last);
  let i = 0;
  while (i < table.length - 2 && t > table[i + 1][0]) i++;
  // Indexed reads, not array destructuring (iterator protocol): this runs on every evaluation
  // of a convection correlation.
  const below = table[i];
  const above = table[i + 1];
  const w = (t - below[0]) / (above[0] - below[0]);
  const conductivity = below[1] + w * (above[1] - below[1]);
  const kinematicViscosity = below[2] + w * (above[2] - below[2]);
  const prandtl = below[3] + w * (above[3] - below[3]);
  return {
    temperatureK,
    conductivity,
    kinematicViscosity,
    thermalDiffusivity: kinematicViscosity / prandtl,
    prandtl,
    // β of an ideal gas at the film temperature (physics.md §2); uses the true temperature.
    expansion: 1 / temperatureK,
    inTable,
  };
}
