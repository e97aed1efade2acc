/**
 * Surface heat transfer: correlations against values worked by hand from the published formulas,
 * radiation against σ, air properties against the table values quoted in references.md, IEC 60287
 * formulae against hand values, and the solver's surface boundary against them.
 *
 * Hand values were worked with a calculator from the formulas as printed in Incropera et al.,
 * Fundamentals of Heat and Mass Transfer (Churchill & Chu 1975, eqs. 9.26 and 9.34; horizontal
 * plates eqs. 9.30–9.32; Churchill & Bernstein 1977, eq. 7.54; flat plate eqs. 7.30 and 7.38);
 * intermediate steps are in the comments so a reviewer can redo them.
 */
import { describe, expect, it } from 'vitest';
import {
  airProperties,
  buriedExternalThermalResistance,
  churchillBernstein,
  churchillChuHorizontalCylinder,
  churchillChuVerticalPlate,
  evaluateConvection,
  flatPlateAverage,
  horizontalPlateLowerHot,
  horizontalPlateUpperHot,
  iecFreeAirCoefficient,
  iecFreeAirSurfaceRise,
  insulationThermalResistance,
  radiationCoefficient,
  radiativeFlux,
  solveSteady,
  STEFAN_BOLTZMANN,
  ThermalInputError,
  type ThermalProblem,
} from '@/lib/thermal';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('natural-convection correlations vs hand-worked values', () => {
  it('Churchill–Chu horizontal cylinder, Ra = 1e6, Pr = 0.707 → Nu = 14.529', () => {
    // (0.559/0.707)^(9/16) = 0.87624; (1 + 0.87624)^(8/27) = 1.20496; Ra^(1/6) = 10;
    // Nu = (0.60 + 0.387·10/1.20496)² = (0.60 + 3.21172)² = 14.5292
    expect(rel(churchillChuHorizontalCylinder(1e6, 0.707), 14.5292)).toBeLessThan(1e-4);
  });

  it('Churchill–Chu vertical plate, Ra = 1e9, Pr = 0.707 → Nu = 122.78', () => {
    // (0.492/0.707)^(9/16) = 0.81551; (1.81551)^(8/27) = 1.19328; Ra^(1/6) = 31.6228;
    // Nu = (0.825 + 0.387·31.6228/1.19328)² = (0.825 + 10.2558)² = 122.785
    expect(rel(churchillChuVerticalPlate(1e9, 0.707), 122.785)).toBeLessThan(1e-4);
  });

  it('horizontal plates: 0.54Ra^¼ = 17.076 (Ra 1e6), 0.15Ra^⅓ = 69.624 (Ra 1e8), 0.52Ra^⅕ = 8.2414 (Ra 1e6)', () => {
    // 1e6^(1/4) = 31.6228 → 17.0763; 1e8^(1/3) = 464.159 → 69.6238; 1e6^(1/5) = 15.8489 → 8.24144
    expect(rel(horizontalPlateUpperHot(1e6).nusselt, 17.0763)).toBeLessThan(1e-4);
    expect(rel(horizontalPlateUpperHot(1e8).nusselt, 69.6238)).toBeLessThan(1e-4);
    expect(rel(horizontalPlateLowerHot(1e6).nusselt, 8.24144)).toBeLessThan(1e-4);
    expect(horizontalPlateUpperHot(1e6).inRange).toBe(true);
    expect(horizontalPlateUpperHot(1e3).inRange).toBe(false); // below 1e4
    expect(horizontalPlateUpperHot(1e12).inRange).toBe(false); // above 1e11
    expect(horizontalPlateLowerHot(1e10).inRange).toBe(false); // above 1e9
  });
});

describe('horizontal plate, upper hot face: the 1e7–2e7 bridge (our choice, see convection.ts)', () => {
  it('is continuous and stays between the published branches', () => {
    let previous = horizontalPlateUpperHot(0.9e7).nusselt;
    for (let ra = 0.9e7; ra <= 2.2e7; ra *= 1.0001) {
      const nu = horizontalPlateUpperHot(ra).nusselt;
      expect(Math.abs(nu - previous)).toBeLessThan(1e-3 * nu); // no jump anywhere
      expect(nu).toBeGreaterThanOrEqual(previous); // increasing with Ra
      if (ra > 1e7 && ra < 2e7) {
        expect(nu).toBeGreaterThanOrEqual(0.54 * ra ** 0.25);
        expect(nu).toBeLessThanOrEqual(0.15 * ra ** (1 / 3));
      }
      previous = nu;
    }
  });
});

describe('forced-convection correlations vs hand-worked values', () => {
  it('Churchill–Bernstein, Re = 1e4, Pr = 0.707 → Nu = 53.540', () => {
    // Pr^(1/3) = 0.890854; (0.4/0.707)^(2/3) = 0.684059; (1.684059)^(1/4) = 1.139172;
    // 0.62·100·0.890854/1.139172 = 48.4852; (1 + (1e4/282000)^(5/8))^(4/5) = 1.098066;
    // Nu = 0.3 + 48.4852·1.098066 = 53.5399
    expect(rel(churchillBernstein(1e4, 0.707), 53.5399)).toBeLessThan(1e-4);
  });

  it('flat plate: laminar Re = 1e5 → 187.06; mixed Re = 1e6 → 1303.8 (Pr = 0.707)', () => {
    // 0.664·316.228·0.890854 = 187.057; (0.037·1e6^0.8 − 871)·0.890854 = (2334.54 − 871)·0.890854 = 1303.80
    expect(rel(flatPlateAverage(1e5, 0.707).nusselt, 187.057)).toBeLessThan(1e-4);
    expect(rel(flatPlateAverage(1e6, 0.707).nusselt, 1303.80)).toBeLessThan(1e-4);
    expect(flatPlateAverage(1e6, 0.707).regime).toBe('mixed');
  });
});

describe('air properties (Incropera Table A.4, from memory, values quoted in references.md)', () => {
  it('returns the 300 K and 350 K rows and interpolates linearly between them', () => {
    const a300 = airProperties(300);
    expect(a300.conductivity).toBeCloseTo(0.0263, 12);
    expect(a300.kinematicViscosity).toBeCloseTo(15.89e-6, 15);
    expect(a300.prandtl).toBeCloseTo(0.707, 12);
    const a350 = airProperties(350);
    expect(a350.conductivity).toBeCloseTo(0.03, 12);
    expect(a350.kinematicViscosity).toBeCloseTo(20.92e-6, 15);
    expect(a350.prandtl).toBeCloseTo(0.7, 12);
    const mid = airProperties(325);
    expect(mid.conductivity).toBeCloseTo(0.02815, 12);
    expect(mid.expansion).toBeCloseTo(1 / 325, 15);
    expect(mid.inTable).toBe(true);
    expect(airProperties(1500).inTable).toBe(false);
  });

  it('h of a 30 mm horizontal cylinder at 60 °C in 20 °C air → 6.676 W/(m²·K), worked by hand', () => {
    // Film 313.15 K: w = 13.15/50 = 0.263; k = 0.0263 + 0.263·0.0037 = 0.0272731;
    // ν = 15.89e-6 + 0.263·5.03e-6 = 17.21289e-6; Pr = 0.707 − 0.263·0.007 = 0.705159;
    // α = ν/Pr = 24.40994e-6; β = 1/313.15; Ra = 9.80665·β·40·0.03³/(ν·α) = 80495.5;
    // (0.559/Pr)^(9/16) = 0.877521; ^(8/27) of 1.877521 → 1.205208;
    // Nu = (0.6 + 0.387·Ra^(1/6)/1.205208)² = 7.34397; h = Nu·k/D = 6.67642
    const e = evaluateConvection({ kind: 'horizontal-cylinder', diameter: 0.03 }, 60, 20);
    expect(rel(e.rayleigh!, 80495.5)).toBeLessThan(1e-5);
    expect(rel(e.nusselt!, 7.34397)).toBeLessThan(1e-5);
    expect(rel(e.h, 6.67642)).toBeLessThan(1e-5);
    expect(e.inRange).toBe(true);
  });
});

describe('radiation (σ = 5.670374419e-8 W/(m²·K⁴), CODATA 2018)', () => {
  it('uses the CODATA 2018 value', () => {
    expect(STEFAN_BOLTZMANN).toBe(5.670374419e-8);
  });

  it('h_r = εσ(Ts + Tsur)(Ts² + Tsur²): ε 0.9, 80 °C to 20 °C → 6.94790 W/(m²·K)', () => {
    // Ts = 353.15 K, Tsur = 293.15 K: Ts + Tsur = 646.3; Ts² + Tsur² = 210651.845;
    // 0.9·5.670374419e-8·646.3·210651.845 = 6.947902
    expect(rel(radiationCoefficient({ emissivity: 0.9, surfaceC: 80, surroundingsC: 20 }), 6.947902)).toBeLessThan(1e-6);
  });

  it('h_r(Ts − Tsur) equals εσ(Ts⁴ − Tsur⁴) (exact factorisation)', () => {
    for (const [ts, tsur] of [[80, 20], [300, -10], [25, 24.9]]) {
      const hr = radiationCoefficient({ emissivity: 0.7, surfaceC: ts, surroundingsC: tsur });
      expect(rel(hr * (ts - tsur), radiativeFlux({ emissivity: 0.7, surfaceC: ts, surroundingsC: tsur }))).toBeLessThan(1e-9);
    }
  });
});

describe('IEC 60287-2-1 formulae (from memory) vs hand values', () => {
  it('T1 = ρ_T/(2π)·ln(1 + 2t/d): 3.5 K·m/W, d 17.5 mm, t 2.6 mm → 0.144922 K·m/W', () => {
    // 3.5/(2π) = 0.557042; ln(1 + 5.2/17.5) = ln(1.297143) = 0.260164; product 0.144922
    expect(rel(insulationThermalResistance({ thermalResistivityKmPerW: 3.5, conductorDiameterM: 0.0175, thicknessM: 0.0026 }), 0.144922)).toBeLessThan(1e-5);
  });

  it('buried T4 = ρ/(2π)·ln(u + √(u² − 1)), u = 2L/De: ρ 1.0, L 0.8 m, De 35 mm → 0.718654 K·m/W', () => {
    // u = 45.714286; √(u² − 1) = 45.703347; ln(91.417633) = 4.515438; /(2π) = 0.718654
    expect(rel(buriedExternalThermalResistance({ soilResistivityKmPerW: 1, depthM: 0.8, externalDiameterM: 0.035 }), 0.718654)).toBeLessThan(1e-5);
    expect(() => buriedExternalThermalResistance({ soilResistivityKmPerW: 1, depthM: 0.01, externalDiameterM: 0.035 })).toThrow(ThermalInputError);
  });

  it('free-air h = Z/De^g + E, single cable, De 30 mm → 5.66166', () => {
    // 0.03^0.6 = 0.1219755; 0.21/0.1219755 = 1.721657; + 3.94 = 5.661657
    expect(rel(iecFreeAirCoefficient({ externalDiameterM: 0.03, Z: 0.21, E: 3.94, g: 0.6 }), 5.661657)).toBeLessThan(1e-6);
  });

  it('the (Δθs)^¼ iteration lands on the fixed point Δθ = Δθs(1 + K_A Δθs^¼)', () => {
    const r = iecFreeAirSurfaceRise({ externalDiameterM: 0.03, conductorRiseK: 60, internalThermalResistanceKmPerW: 0.5 });
    expect(r.KA).toBeCloseTo(Math.PI * 0.03 * r.coefficient * 0.5, 12);
    expect(Math.abs(r.surfaceRiseK * (1 + r.KA * r.surfaceRiseK ** 0.25) - 60)).toBeLessThan(1e-9);
    // Heat through the cable equals heat off the surface: (Δθ − Δθs)/T_int = πDe h Δθs^(5/4).
    expect(rel((60 - r.surfaceRiseK) / 0.5, r.heatPerMetreW)).toBeLessThan(1e-9);
    expect(r.iterations).toBeGreaterThan(2);
  });
});

/** Idealised isothermal core (k = 1e6) with constant heat W per metre inside one insulating layer. */
function cableWithSurface(outer: ThermalProblem['outer']): ThermalProblem {
  return {
    geometry: {
      kind: 'cylinder',
      layers: [
        { thickness: 0.01, conductivity: 1e6, generating: true },
        { thickness: 0.005, conductivity: 1 / 3.5 },
      ],
    },
    source: { kind: 'joule', current: 400, area: Math.PI * 1e-4, rho20: 0.1e-3 * Math.PI * 1e-4, alpha20: 0 },
    inner: { kind: 'symmetry' },
    outer,
  };
}

describe('solver surface boundary', () => {
  it('with the IEC free-air coefficient reproduces the IEC (Δθs)^¼ iteration (IEC 60287-2-1, from memory)', () => {
    const r = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, convection: { kind: 'iec-60287-free-air' } }));
    expect(r.converged).toBe(true);
    const heat = 400 * 400 * 0.1e-3; // α = 0: 16 W/m
    expect(r.heatGeneratedWPerM).toBeCloseTo(heat, 9);
    const tInt = Math.log(0.015 / 0.01) / (2 * Math.PI * (1 / 3.5));
    const iec = iecFreeAirSurfaceRise({ externalDiameterM: 0.03, conductorRiseK: r.hotSpot.temperature - 30, internalThermalResistanceKmPerW: tInt });
    expect(Math.abs(r.surfaceTemperature - 30 - iec.surfaceRiseK)).toBeLessThan(1e-4);
    // and directly: W = πDe·h·Δθs^(5/4)
    expect(rel(heat, Math.PI * 0.03 * 5.661657 * (r.surfaceTemperature - 30) ** 1.25)).toBeLessThan(1e-6);
  });

  it('surface heat flux = h_conv(Ts−T∞) + h_rad(Ts−Tsur) and equals the heat generated per area', () => {
    const r = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } }));
    const s = r.surface.outer!;
    expect(s.temperature).toBe(r.surfaceTemperature);
    expect(rel(s.heatFlux, s.hConv * (s.temperature - 30) + s.hRad * (s.temperature - 30))).toBeLessThan(1e-12);
    expect(rel(s.heatFlux * Math.PI * 0.03, 16)).toBeLessThan(1e-6);
    const convection = evaluateConvection({ kind: 'horizontal-cylinder', diameter: 0.03 }, s.temperature, 30);
    expect(s.hConv).toBeCloseTo(convection.h, 12);
    expect(s.hRad).toBeCloseTo(radiationCoefficient({ emissivity: 0.9, surfaceC: s.temperature, surroundingsC: 30 }), 12);
    expect(s.rayleigh).toBeGreaterThan(1e3);
    expect(s.inRange).toBe(true);
    expect(r.energyResidual).toBeLessThan(1e-6);
  });

  it('cross-check: Churchill–Chu + radiation (ε 0.9) and the IEC free-air method agree on the surface rise within 20 % (sanity bound, the methods differ by design)', () => {
    const cc = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, emissivity: 0.9, convection: { kind: 'horizontal-cylinder' } }));
    const iec = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, convection: { kind: 'iec-60287-free-air' } }));
    expect(rel(cc.surfaceTemperature - 30, iec.surfaceTemperature - 30)).toBeLessThan(0.2);
  });

  it('flags a correlation used outside its range (narrow bar laid flat: Ra below 1e4)', () => {
    const r = solveSteady({
      geometry: { kind: 'slab', layers: [{ thickness: 0.005, conductivity: 390, generating: true }] },
      source: { kind: 'uniform', q: 2e6 },
      inner: { kind: 'surface', ambient: 30, convection: { kind: 'horizontal-plate', facing: 'down', length: 0.005 } },
      outer: { kind: 'surface', ambient: 30, convection: { kind: 'horizontal-plate', facing: 'up', length: 0.005 } },
    });
    expect(r.converged).toBe(true);
    expect(r.surface.outer!.rayleigh).toBeLessThan(1e4);
    expect(r.surface.outer!.inRange).toBe(false);
    expect(r.flags.some((f) => f.code === 'correlation-out-of-range')).toBe(true);
  });

  it('with nothing driving heat the body sits at ambient (h → 0 at ΔT → 0 for a horizontal plate)', () => {
    const r = solveSteady({
      geometry: { kind: 'slab', layers: [{ thickness: 0.01, conductivity: 1, generating: true }] },
      source: { kind: 'joule', current: 0, area: 1e-4, rho20: 1.7e-8, alpha20: 4e-3 },
      inner: { kind: 'symmetry' },
      outer: { kind: 'surface', ambient: 12, convection: { kind: 'horizontal-plate', facing: 'up', length: 0.05 } },
    });
    expect(r.converged).toBe(true);
    for (const t of r.temperatures) expect(t).toBe(12);
  });

  it('absorbed (solar) flux raises the surface and closes the balance', () => {
    const base = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, h: 10 }));
    const sunny = solveSteady(cableWithSurface({ kind: 'surface', ambient: 30, h: 10, absorbedFlux: 100 }));
    // Linear surface: the extra rise is exactly q_abs/h = 10 K, to round-off of the k = 1e6 core
    // whose conductances are 1e8 times the surface's: ε·1e8·(tens of K) ≈ 2e-16·1e8·50 ≈ 1e-6 K, and
    // the last bits of that vary with the order of operations (seen from 1e-7 to 4e-6 K). 1e-4 K
    // stays five orders of magnitude below the 10 K being checked.
    expect(Math.abs(sunny.surfaceTemperature - base.surfaceTemperature - 100 / 10)).toBeLessThan(1e-4);
    expect(sunny.energyResidual).toBeLessThan(1e-6);
  });
});
