/**
 * Convection coefficients from published correlations, properties of air at the film
 * temperature (physics.md §2). Equation numbers are those of Incropera, DeWitt, Bergman & Lavine,
 * *Fundamentals of Heat and Mass Transfer*, 6th/7th ed. (cited from memory); the correlations
 * themselves are the authors' published forms.
 */
import { airProperties } from './air';
import { KELVIN_OFFSET, STANDARD_GRAVITY } from './constants';
import type { ConvectionEvaluation } from './types';
import type { NormalizedConvection } from './normalized';

// ---------------------------------------------------------------------------------------------
// Nusselt correlations (pure functions of the dimensionless groups)
// ---------------------------------------------------------------------------------------------

// Roots by square and cube roots rather than Math.pow with a fractional exponent, which costs
// several times more: a surface's correlation runs three times per outer pass (value and the two
// sides of its numerical slope). Same values to the last bit or two.
function sixthRoot(x: number): number {
  return Math.cbrt(Math.sqrt(x));
}

function fourthRoot(x: number): number {
  return Math.sqrt(Math.sqrt(x));
}

/**
 * Churchill and Chu's Prandtl function [1 + (c/Pr)^(9/16)]^(8/27), written with exp, log and
 * log1p: two Math.pow calls with these exponents cost about twice as much. Equal to the power
 * form to round-off (the exponents' arguments are of order one).
 */
function churchillChuPrandtlFactor(c: number, prandtl: number): number {
  return Math.exp((8 / 27) * Math.log1p(Math.exp((9 / 16) * Math.log(c / prandtl))));
}

/** Churchill & Chu (1975), long horizontal cylinder, Incropera eq. 9.34; 1e-5 ≤ Ra_D ≤ 1e12. */
export function churchillChuHorizontalCylinder(rayleigh: number, prandtl: number): number {
  const denominator = churchillChuPrandtlFactor(0.559, prandtl);
  const root = 0.6 + (0.387 * sixthRoot(rayleigh)) / denominator;
  return root * root;
}
export const HORIZONTAL_CYLINDER_RANGE = { min: 1e-5, max: 1e12 } as const;

/** Churchill & Chu (1975), vertical plate, whole range, Incropera eq. 9.26; 1e-1 ≤ Ra_L ≤ 1e12. */
export function churchillChuVerticalPlate(rayleigh: number, prandtl: number): number {
  const denominator = churchillChuPrandtlFactor(0.492, prandtl);
  const root = 0.825 + (0.387 * sixthRoot(rayleigh)) / denominator;
  return root * root;
}
export const VERTICAL_PLATE_RANGE = { min: 1e-1, max: 1e12 } as const;

/**
 * Upper face of a hot plate (or lower face of a cold one), L = area/perimeter:
 * Nu = 0.54 Ra^¼ for 1e4 ≤ Ra ≤ 1e7 (Pr ≥ 0.7), Nu = 0.15 Ra^⅓ for 1e7 ≤ Ra ≤ 1e11
 * (Incropera eqs. 9.30, 9.31).
 *
 * The two published branches disagree by 6 % at Ra = 1e7 (30.4 vs 32.3). A jump in q(Ts) can leave
 * a heat flow with no surface temperature at all (the outer iteration then cycles across it), so
 * between 1e7 and 2e7 this blends the branches linearly in log Ra — our choice, not published.
 * The blend stays between the two branches, i.e. never above the turbulent value the correlation
 * gives there; outside that window the published forms are used unchanged.
 */
export function horizontalPlateUpperHot(rayleigh: number): { nusselt: number; inRange: boolean } {
  if (rayleigh <= 1e7) return { nusselt: 0.54 * fourthRoot(rayleigh), inRange: rayleigh >= 1e4 };
  const turbulent = 0.15 * Math.cbrt(rayleigh);
  if (rayleigh >= 2e7) return { nusselt: turbulent, inRange: rayleigh <= 1e11 };
  const w = Math.log(rayleigh / 1e7) / Math.LN2;
  return { nusselt: (1 - w) * 0.54 * fourthRoot(rayleigh) + w * turbulent, inRange: true };
}

/**
 * Lower face of a hot plate (or upper face of a cold one), L = area/perimeter:
 * Nu = 0.52 Ra^⅕ for 1e4 ≤ Ra ≤ 1e9, Pr ≥ 0.7 (Incropera 7th ed. eq. 9.32).
 */
export function horizontalPlateLowerHot(rayleigh: number): { nusselt: number; inRange: boolean } {
  return { nusselt: 0.52 * rayleigh ** 0.2, inRange: rayleigh >= 1e4 && rayleigh <= 1e9 };
}

/** Churchill & Bernstein (1977), cylinder in cross-flow, Incropera eq. 7.54; Re·Pr ≥ 0.2. */
export function churchillBernstein(reynolds: number, prandtl: number): number {
  const cubeRootOfRatio = Math.cbrt(0.4 / prandtl);
  const laminar = (0.62 * Math.sqrt(reynolds) * Math.cbrt(prandtl)) / fourthRoot(1 + cubeRootOfRatio * cubeRootOfRatio);
  return 0.3 + laminar * (1 + (reynolds / 282000) ** (5 / 8)) ** (4 / 5);
}

/**
 * Average Nusselt number over a flat plate in parallel flow, transition at Re = 5e5:
 * laminar 0.664 Re^½ Pr^⅓ (Incropera eq. 7.30, Pr ≥ 0.6); mixed laminar/turbulent
 * (0.037 Re^⅘ − 871) Pr^⅓ (eq. 7.38, 5e5 < Re ≤ 1e8, 0.6 ≤ Pr ≤ 60).
 */
export function flatPlateAverage(reynolds: number, prandtl: number): { nusselt: number; regime: 'laminar' | 'mixed'; inRange: boolean } {
  const prOk = prandtl >= 0.6 && prandtl <= 60;
  if (reynolds <= 5e5) {
    return { nusselt: 0.664 * Math.sqrt(reynolds) * Math.cbrt(prandtl), regime: 'laminar', inRange: prOk };
  }
  return {
    nusselt: (0.037 * reynolds ** 0.8 - 871) * Math.cbrt(prandtl),
    regime: 'mixed',
    inRange: prOk && reynolds <= 1e8,
  };
}

/** Ra = gβ|ΔT|L³/(να) with air at the film temperature. */
export function rayleighNumber(args: { lengthM: number; surfaceC: number; ambientC: number; deltaK?: number }): {
  rayleigh: number;
  filmTemperatureK: number;
  air: ReturnType<typeof airProperties>;
} {
  const filmTemperatureK = 0.5 * (args.surfaceC + args.ambientC) + KELVIN_OFFSET;
  const air = airProperties(filmTemperatureK);
  const deltaK = Math.abs(args.deltaK ?? args.surfaceC - args.ambientC);
  const cubedLengthM3 = args.lengthM * args.lengthM * args.lengthM;
  const rayleigh = (STANDARD_GRAVITY * air.expansion * deltaK * cubedLengthM3) / (air.kinematicViscosity * air.thermalDiffusivity);
  return { rayleigh, filmTemperatureK, air };
}

/** IEC 60287-2-1 free-air coefficient (from memory) h = Z/De^g + E, W/(m²·K^(5/4)), De in metres. */
export function iecFreeAirCoefficient(args: { externalDiameterM: number; Z: number; E: number; g: number }): number {
  return args.Z / args.externalDiameterM ** args.g + args.E;
}

// ---------------------------------------------------------------------------------------------
// Convection coefficient for a surface
// ---------------------------------------------------------------------------------------------

function natural(
  correlation: string,
  lengthM: number,
  surfaceC: number,
  ambientC: number,
  deltaK: number,
  nusseltOf: (ra: number, pr: number) => { nusselt: number; inRange: boolean },
  validRange: string,
): ConvectionEvaluation {
  const { rayleigh, filmTemperatureK, air } = rayleighNumber({ lengthM, surfaceC, ambientC, deltaK });
  const { nusselt, inRange } = nusseltOf(rayleigh, air.prandtl);
  return {
    h: (nusselt * air.conductivity) / lengthM,
    correlation,
    nusselt,
    rayleigh,
    prandtl: air.prandtl,
    filmTemperatureK,
    inRange: inRange && air.inTable,
    validRange,
    airPropertiesInTable: air.inTable,
  };
}

function forced(
  correlation: string,
  lengthM: number,
  velocity: number,
  surfaceC: number,
  ambientC: number,
  nusseltOf: (re: number, pr: number) => { nusselt: number; inRange: boolean; correlation?: string },
  validRange: string,
): ConvectionEvaluation {
  const filmTemperatureK = 0.5 * (surfaceC + ambientC) + KELVIN_OFFSET;
  const air = airProperties(filmTemperatureK);
  const reynolds = (velocity * lengthM) / air.kinematicViscosity;
  const result = nusseltOf(reynolds, air.prandtl);
  return {
    h: (result.nusselt * air.conductivity) / lengthM,
    correlation: result.correlation ?? correlation,
    nusselt: result.nusselt,
    reynolds,
    prandtl: air.prandtl,
    filmTemperatureK,
    inRange: result.inRange && air.inTable,
    validRange,
    airPropertiesInTable: air.inTable,
  };
}

/**
 * Convection coefficient (secant, q = h·(Ts − T∞)) of a surface at `surfaceC` in air at
 * `ambientC`. A horizontal plate colder than the air swaps faces: the upper face of a cold plate
 * behaves as the lower face of a hot one and vice versa (Incropera §9.6.2).
 */
export function evaluateConvection(
  spec: NormalizedConvection,
  surfaceC: number,
  ambientC: number,
  deltaK: number = surfaceC - ambientC,
): ConvectionEvaluation {
  switch (spec.kind) {
    case 'horizontal-cylinder':
      return natural(
        'Churchill–Chu horizontal cylinder (Incropera eq. 9.34)',
        spec.diameter,
        surfaceC,
        ambientC,
        deltaK,
        (ra, pr) => ({
          nusselt: churchillChuHorizontalCylinder(ra, pr),
          inRange: ra >= HORIZONTAL_CYLINDER_RANGE.min && ra <= HORIZONTAL_CYLINDER_RANGE.max,
        }),
        '1e-5 ≤ Ra_D ≤ 1e12',
      );
    case 'vertical-plate':
      return natural(
        'Churchill–Chu vertical plate (Incropera eq. 9.26)',
        spec.height,
        surfaceC,
        ambientC,
        deltaK,
        (ra, pr) => ({
          nusselt: churchillChuVerticalPlate(ra, pr),
          inRange: ra >= VERTICAL_PLATE_RANGE.min && ra <= VERTICAL_PLATE_RANGE.max,
        }),
        '1e-1 ≤ Ra_L ≤ 1e12',
      );
    case 'horizontal-plate': {
      const hot = deltaK >= 0;
      const upperHotLike = (spec.facing === 'up') === hot;
      return upperHotLike
        ? natural(
            'horizontal plate, upper face of hot plate: 0.54Ra^¼ / 0.15Ra^⅓ (Incropera eqs. 9.30–9.31)',
            spec.length,
            surfaceC,
            ambientC,
            deltaK,
            (ra, pr) => {
              const r = horizontalPlateUpperHot(ra);
              return { nusselt: r.nusselt, inRange: r.inRange && (ra > 1e7 || pr >= 0.7) };
            },
            '1e4 ≤ Ra_L ≤ 1e11',
          )
        : natural(
            'horizontal plate, lower face of hot plate: 0.52Ra^⅕ (Incropera eq. 9.32)',
            spec.length,
            surfaceC,
            ambientC,
            deltaK,
            (ra, pr) => {
              const r = horizontalPlateLowerHot(ra);
              return { nusselt: r.nusselt, inRange: r.inRange && pr >= 0.7 };
            },
            '1e4 ≤ Ra_L ≤ 1e9, Pr ≥ 0.7',
          );
    }
    case 'forced-cylinder':
      return forced(
        'Churchill–Bernstein cylinder in cross-flow (Incropera eq. 7.54)',
        spec.diameter,
        spec.velocity,
        surfaceC,
        ambientC,
        (re, pr) => ({ nusselt: churchillBernstein(re, pr), inRange: re * pr >= 0.2 }),
        'Re·Pr ≥ 0.2',
      );
    case 'forced-plate':
      return forced(
        'flat plate in parallel flow',
        spec.length,
        spec.velocity,
        surfaceC,
        ambientC,
        (re, pr) => {
          const r = flatPlateAverage(re, pr);
          return {
            nusselt: r.nusselt,
            inRange: r.inRange,
            correlation:
              r.regime === 'laminar'
                ? 'flat plate, laminar 0.664Re^½Pr^⅓ (Incropera eq. 7.30)'
                : 'flat plate, mixed (0.037Re^⅘ − 871)Pr^⅓ (Incropera eq. 7.38)',
          };
        },
        'laminar Re ≤ 5e5; mixed 5e5 < Re ≤ 1e8; 0.6 ≤ Pr ≤ 60',
      );
    case 'iec-60287-free-air': {
      const coefficient = iecFreeAirCoefficient({ externalDiameterM: spec.diameter, Z: spec.Z, E: spec.E, g: spec.g });
      // Heat per m² = h·Δθs^(5/4), i.e. a secant coefficient h·Δθs^(1/4); it includes radiation.
      return {
        h: coefficient * fourthRoot(Math.abs(deltaK)),
        correlation: 'IEC 60287-2-1 free air h = Z/De^g + E (convection and radiation together)',
        inRange: true,
      };
    }
  }
}
