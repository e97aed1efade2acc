/**
 * The product's ampacity (bracketing root finder on the finite-volume heat balance) against the
 * IEC 60287-1-1 closed form with the same external thermal resistance:
 *   I = √(Δθ / (R_ac(θ_max)·(T₁ + T₃ + T₄)))   (eq. (1) with W_d = 0, λ₁ = λ₂ = 0),
 *   T₁ = ρ_T/(2π)·ln(1 + 2t₁/d_c), T₃ = ρ_T/(2π)·ln(1 + 2t₃/D_a) (IEC 60287-2-1),
 * T₄ buried = ρ_soil/(2π)·ln(u + √(u² − 1)), u = 2L/D_e; T₄ in air with a fixed combined
 * coefficient = 1/(πD_e·h). The closed form is evaluated here, independently of the product.
 */
import type { CableCandidate, Conditions } from '../../electrical';
import type { VerificationCase } from '../types';

const sectionMm2 = 240;
const r20 = 0.0754e-3; // Ω/m, IEC 60228 Table 2 copper class 2 (from memory)
const alpha20 = 3.93e-3; // IEC 60287-1-1 Table 1
const conductorDiameterM = 1.2e-3 * Math.sqrt(sectionMm2); // round compacted stranding, ≈1.2√S mm (common practice)
const insulation = { thicknessM: 1.7e-3, rhoT: 3.5 }; // XLPE, IEC 60287-2-1 Table 1 (from memory)
const sheath = { thicknessM: 1.8e-3, rhoT: 5.0 }; // PVC sheath (from memory)
const limitC = 90; // XLPE continuous limit (common practice)
const overSheathM = conductorDiameterM + 2 * (insulation.thicknessM + sheath.thicknessM);

const cable: CableCandidate = {
  kind: 'cable',
  id: 'verification-cu-xlpe-240',
  label: 'Cu/XLPE/PVC 1×240 mm² (verification input)',
  material: 'copper',
  sectionMm2,
  r20OhmPerM: r20,
  conductorDiameterM,
  layers: [
    { name: 'XLPE insulation', role: 'insulation', thicknessM: insulation.thicknessM, thermalResistivityKmPerW: insulation.rhoT, continuousLimitC: limitC, shortCircuitLimitC: 250 },
    { name: 'PVC sheath', role: 'sheath', thicknessM: sheath.thicknessM, thermalResistivityKmPerW: sheath.rhoT },
  ],
  emissivity: 0.9,
};

const t1 = (insulation.rhoT / (2 * Math.PI)) * Math.log(1 + (2 * insulation.thicknessM) / conductorDiameterM);
const t3 = (sheath.rhoT / (2 * Math.PI)) * Math.log(1 + (2 * sheath.thicknessM) / (conductorDiameterM + 2 * insulation.thicknessM));
const rAt90 = r20 * (1 + alpha20 * (limitC - 20));

const cableInputs = [
  { name: 'conductor', value: `copper ${sectionMm2} mm², R₂₀ ${r20 * 1e3} Ω/km (IEC 60228, from memory)` },
  { name: 'conductor diameter d_c (≈1.2√S mm, common practice)', value: Number((conductorDiameterM * 1e3).toPrecision(5)), unit: 'mm' },
  { name: 'XLPE insulation t₁ / ρ_T (from memory)', value: `${insulation.thicknessM * 1e3} mm / ${insulation.rhoT} K·m/W` },
  { name: 'PVC sheath t₃ / ρ_T (from memory)', value: `${sheath.thicknessM * 1e3} mm / ${sheath.rhoT} K·m/W` },
  { name: 'conductor limit', value: limitC, unit: '°C' },
];

const baseConditions: Omit<Conditions, 'installation' | 'frequencyHz'> = {
  designCurrentA: 100,
  phases: 3,
  nominalVoltageV: 230,
  lengthM: 50,
  powerFactor: 0.9,
  reactanceOhmPerM: 0.08e-3,
};

// ── Buried, direct current: R_ac = R_dc, T₄ from the soil ─────────────────────────────────────
// A two-wire DC circuit, its cables side by side 0.3 m apart at the same depth: each cable's T₄
// is its own ρ/(2π)·ln(u + √(u² − 1)) plus the other's equal heat through ρ/(2π)·ln(d′/d),
// d = 0.3 m, d′ = √(0.3² + (2L)²) (IEC 60287-2-1 §4.2.3, equally loaded group).
const buried = { depthM: 0.8, soilRhoT: 1.5, groundC: 20, spacingM: 0.3 };
const u = (2 * buried.depthM) / overSheathM;
const t4Own = (buried.soilRhoT / (2 * Math.PI)) * Math.log(u + Math.sqrt(u * u - 1));
const t4Mutual = (buried.soilRhoT / (2 * Math.PI)) * Math.log(Math.hypot(buried.spacingM, 2 * buried.depthM) / buried.spacingM);
const t4Buried = t4Own + t4Mutual;
const buriedReference = Math.sqrt((limitC - buried.groundC) / (rAt90 * (t1 + t3 + t4Buried)));

const buriedCase: VerificationCase = {
  id: 'ampacity-buried-dc',
  title: 'Ampacity of a buried two-wire DC circuit of single-core cables: solver against the IEC 60287 closed form',
  area: 'ampacity',
  source: {
    kind: 'standard',
    citation: 'IEC 60287-1-1 eq. (1) with W_d = 0, λ = 0; T₁, T₃ and T₄ = ρ/(2π)·[ln(u + √(u² − 1)) + ln(d′/d)] of IEC 60287-2-1 §4.2.3 (two equally loaded cables)',
  },
  inputs: [
    ...cableInputs,
    { name: 'depth of the axis L', value: buried.depthM, unit: 'm' },
    { name: 'soil ρ_T', value: buried.soilRhoT, unit: 'K·m/W' },
    { name: 'ground', value: buried.groundC, unit: '°C' },
    { name: 'axis spacing of the two cables d', value: buried.spacingM, unit: 'm' },
    { name: 'frequency', value: 0, unit: 'Hz' },
  ],
  notes:
    `T₁ = ${t1.toPrecision(6)}, T₃ = ${t3.toPrecision(6)}, u = 2L/D_e = ${u.toPrecision(6)}, T₄ = ${t4Own.toPrecision(6)} + ${t4Mutual.toPrecision(6)} (the other cable) = ${t4Buried.toPrecision(6)} K·m/W; ` +
    `R(90 °C) = ${rAt90.toPrecision(6)} Ω/m; I = √(70/(R·ΣT)) = ${buriedReference.toPrecision(6)} A. ` +
    'The solver takes the conductor as a conducting cylinder (not isothermal) and finds the current to 0.1 A from below; 0.1 % allows for both.',
  quantities: [{ key: 'current', label: 'ampacity', unit: 'A', reference: buriedReference, tolerance: { kind: 'relative', value: 0.001 } }],
  compute(lib) {
    const r = lib.ampacity(cable, {
      ...baseConditions,
      frequencyHz: 0,
      phases: 1,
      installation: { kind: 'buried', depthM: buried.depthM, soilResistivityKmPerW: buried.soilRhoT, groundC: buried.groundC, formation: 'flat', spacingM: buried.spacingM },
    });
    return {
      values: { current: r.current },
      details: [
        `hot spot ${r.hotSpot.temperature.toFixed(3)} °C, ${r.solves} heat-balance solves`,
        r.closedForm ? `the product's own closed-form cross-check: ${r.closedForm.currentA.toFixed(2)} A (${r.closedForm.differencePercent.toFixed(3)} %)` : 'no closed-form cross-check reported',
      ],
    };
  },
};

// ── In air at 50 Hz with a fixed combined surface coefficient ─────────────────────────────────
const air = { h: 7, ambientC: 30, frequencyHz: 50, spacingM: 0.05 };
const t4Air = 1 / (Math.PI * overSheathM * air.h);
// IEC 60287-1-1 §2.1.2 and §2.1.4.1 (three single-core cables; the y_p expression from memory).
const x2 = (8 * Math.PI * air.frequencyHz * 1e-7) / rAt90;
const ysAir = (x2 * x2) / (192 + 0.8 * x2 * x2);
const ratio2 = (conductorDiameterM / air.spacingM) ** 2;
const ypAir = ysAir * ratio2 * (0.312 * ratio2 + 1.18 / (ysAir + 0.27));
const rAcAt90 = rAt90 * (1 + ysAir + ypAir);
const airReference = Math.sqrt((limitC - air.ambientC) / (rAcAt90 * (t1 + t3 + t4Air)));

const airCase: VerificationCase = {
  id: 'ampacity-air-ac-fixed-h',
  title: 'Ampacity in air at 50 Hz with a fixed surface coefficient: solver against the IEC 60287 closed form',
  area: 'ampacity',
  source: {
    kind: 'standard',
    citation:
      "IEC 60287-1-1 eq. (1) with W_d = 0, λ = 0; R_ac = R'(1 + y_s + y_p) of §2.1 (y_p for three single-core cables, from memory); T₄ = 1/(πD_e·h) for the same fixed h",
  },
  inputs: [
    ...cableInputs,
    { name: 'combined surface coefficient h', value: air.h, unit: 'W/(m²·K)' },
    { name: 'ambient', value: air.ambientC, unit: '°C' },
    { name: 'frequency', value: air.frequencyHz, unit: 'Hz' },
    { name: 'trefoil, axis spacing s', value: air.spacingM, unit: 'm' },
  ],
  notes:
    `T₁ = ${t1.toPrecision(6)}, T₃ = ${t3.toPrecision(6)}, T₄ = 1/(πD_e·h) = ${t4Air.toPrecision(6)} K·m/W; ` +
    `x_s² = x_p² = 8πf·1e-7/R' = ${x2.toPrecision(6)}; y_s = ${ysAir.toPrecision(5)}; (d_c/s)² = ${ratio2.toPrecision(5)}; y_p = ${ypAir.toPrecision(5)}; ` +
    `R_ac(90 °C) = ${rAcAt90.toPrecision(6)} Ω/m; I = √(60/(R_ac·ΣT)) = ${airReference.toPrecision(6)} A.`,
  quantities: [{ key: 'current', label: 'ampacity', unit: 'A', reference: airReference, tolerance: { kind: 'relative', value: 0.001 } }],
  compute(lib) {
    const r = lib.ampacity(cable, {
      ...baseConditions,
      frequencyHz: air.frequencyHz,
      ambientC: air.ambientC,
      surfaceCoefficientWPerM2K: air.h,
      installation: { kind: 'cable-in-air', formation: 'trefoil', spacingM: air.spacingM },
    });
    return {
      values: { current: r.current },
      details: [`hot spot ${r.hotSpot.temperature.toFixed(3)} °C, R_ac/R_dc ${r.acFactor.toFixed(5)}, ${r.solves} heat-balance solves`],
    };
  },
};

export const ampacityCases: VerificationCase[] = [buriedCase, airCase];
