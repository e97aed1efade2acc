/** Physical constants and defaults shared by the thermal solver. SI throughout. */

/** Stefan–Boltzmann constant, W/(m²·K⁴): CODATA 2018 recommended value (exact in the 2019 SI). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

/** 0 K expressed in °C; temperatures below this are rejected as input errors. */
export const ABSOLUTE_ZERO_C = -273.15;

/** Add to °C to get kelvin. Radiation and gas properties need absolute temperature. */
export const KELVIN_OFFSET = 273.15;

/** Standard acceleration of gravity, m/s² (3rd CGPM, 1901), for Rayleigh numbers. */
export const STANDARD_GRAVITY = 9.80665;

/** Cells per layer when a layer does not say (physics.md §1). */
export const DEFAULT_CELLS_PER_LAYER = 40;

/** Outer-iteration stop: largest temperature change between passes, K (physics.md §1). */
export const DEFAULT_TOLERANCE_K = 1e-6;

/** Energy balance closure demanded after convergence, relative (physics.md §1). */
export const DEFAULT_ENERGY_TOLERANCE = 1e-6;

export const DEFAULT_MAX_ITERATIONS = 200;

/** Under-relaxation used with the lagged Joule form (Patankar 1980, §4.2-5 / §7.2-2). */
export const DEFAULT_RELAXATION = 0.7;

/**
 * Above this hot-spot temperature (°C) an iteration is treated as having no bounded steady
 * state. Every conductor and insulation of interest has failed long before (copper melts at
 * about 1085 °C, aluminium at about 660 °C — common practice), and the air table ends at 1000 K.
 */
export const DEFAULT_TEMPERATURE_LIMIT_C = 2000;
