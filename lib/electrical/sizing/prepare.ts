/**
 * Validation and normalisation of candidates and conditions, and the assumption flags that follow
 * from the inputs alone (no solve needed). Every refusal names the field.
 */
import {
  ElectricalInputError,
  requireFinite,
  requireInteger,
  requireNonNegative,
  requirePositive,
  requireRange,
  requireTemperature,
} from '../errors';
import { materialConstants, type ConductorMaterial, type ConductorMaterialConstants } from '../materials';
import { toMoney } from '../economics';
import { FlagSet, fmt } from './flags';
import type {
  BarCandidate,
  CableCandidate,
  Candidate,
  Conditions,
  EconomicsInputs,
  GoverningLimit,
  LimitSource,
} from './types';

/** Reference ambients when none is entered (flagged AMBIENT_ASSUMED). */
export const DEFAULT_AIR_AMBIENT_CABLE_C = 30; // IEC 60364-5-52 reference ambient for air (from memory)
export const DEFAULT_AIR_AMBIENT_BAR_C = 40; // IEC 61439-1 upper ambient for indoor assemblies (from memory)
export const DEFAULT_GROUND_C = 20; // IEC 60364-5-52 reference ground temperature (from memory)
export const DEFAULT_SOIL_RESISTIVITY_KM_PER_W = 2.5; // IEC 60364-5-52 tables for buried cables (from memory)
/** Jacket emissivity when none is given (PVC/PE, common practice ~0.9). */
export const DEFAULT_CABLE_EMISSIVITY = 0.9;
/** Bare bright metal: low emissivity is the cautious guess (less radiation, hotter bar). */
export const DEFAULT_BARE_BAR_EMISSIVITY = 0.1;
/** Painted or coated bar surface without a stated emissivity (common practice ~0.9). */
export const DEFAULT_COATED_BAR_EMISSIVITY = 0.9;
/** Solar absorption when none is given: IEC 60287-2-1 Table 4's highest listed value (0.8, from memory). */
export const DEFAULT_SOLAR_ABSORPTIVITY = 0.8;
/** Adiabatic short-circuit method range (IEC 60364-4-43, from memory). */
export const ADIABATIC_MAX_DURATION_S = 5;

export interface PreparedLayer {
  name: string;
  role: string;
  thicknessM: number;
  conductivityWPerMK: number;
  generating: boolean;
  /** Continuous limit of this layer (after any user override), °C. */
  limitC?: number;
  /** True when this layer is in contact with the conductor. */
  contact: boolean;
}

export interface PreparedCandidate {
  index: number;
  id: string;
  label: string;
  kind: 'cable' | 'bar';
  source: Candidate;
  material: ConductorMaterial;
  constants: Readonly<ConductorMaterialConstants>;
  alpha20: number;
  /** R20 of one conductor (core or bar), Ω/m. */
  r20: number;
  /** Conductors of one phase sharing its current (parallel runs × bars per pack). */
  conductorsPerPhase: number;
  parallel: number;
  barsPerPhase: number;
  sectionPerConductorMm2: number;
  sectionPerPhaseMm2: number;
  /** Cable: cores in one cable; loaded cores modelled as one equivalent conductor. */
  cores: number;
  loadedCores: number;
  /** Conductor contact limit candidates (coverings, terminal, user). */
  contactLimit: GoverningLimit;
  /** Layers outside the contact layer with their own limits (cables). */
  layers: PreparedLayer[];
  emissivity: number;
  /** Cable: conductor diameter d_c and outer diameter D_e (m). */
  conductorDiameterM?: number;
  outerDiameterM?: number;
  /** Bar: dimensions (m). */
  widthM?: number;
  thicknessM?: number;
  shortCircuitLimitC?: number;
  /** Metallic screen or armour present. */
  hasMetallicLayer: boolean;
}

export interface PreparedConditions {
  source: Conditions;
  designCurrentA: number;
  frequencyHz: number;
  phases: 1 | 3;
  nominalVoltageV: number;
  lengthM: number;
  powerFactor: number;
  reactanceOhmPerM?: number;
  maxVoltageDropPercent?: number;
  /** Air or ground temperature the conductor sees (°C), and whether it was assumed. */
  ambientC: number;
  ambientAssumed: boolean;
  placement: 'cable-in-air' | 'bar-on-edge' | 'bar-flat' | 'buried';
  enclosureFactor: number;
  groupingFactor: number;
  formation: 'trefoil' | 'flat';
  spacingM?: number;
  buried?: { depthM: number; soilResistivityKmPerW: number; soilAssumed: boolean; groundAssumed: boolean };
  windSpeedMPerS: number;
  solar?: { irradianceWPerM2: number; absorptivity: number; absorptivityAssumed: boolean };
  fault?: { currentA: number; durationS: number; initialFrom: 'limit' | 'operating' };
  userLimitC?: number;
  raiseMaterialLimit: boolean;
  surfaceCoefficientWPerM2K?: number;
  economics?: EconomicsInputs;
}

function optional<T>(value: T | undefined | null, check: (v: T) => number): number | undefined {
  return value === undefined || value === null ? undefined : check(value);
}

// ───────────────────────────── Conditions ─────────────────────────────

export function prepareConditions(c: Conditions, flags?: FlagSet): PreparedConditions {
  if (c === null || typeof c !== 'object') throw new ElectricalInputError('conditions', 'must be an object');
  const f = (name: string) => `conditions.${name}`;
  const designCurrentA = requireNonNegative(c.designCurrentA, f('designCurrentA'));
  const frequencyHz = requireRange(c.frequencyHz, f('frequencyHz'), 0, 1000);
  if (c.phases !== 1 && c.phases !== 3) throw new ElectricalInputError(f('phases'), `must be 1 or 3 (got ${String(c.phases)})`);
  const nominalVoltageV = requirePositive(c.nominalVoltageV, f('nominalVoltageV'));
  const lengthM = requireNonNegative(c.lengthM, f('lengthM'));
  const powerFactor = requireRange(c.powerFactor, f('powerFactor'), 0, 1);
  const reactanceOhmPerM = optional(c.reactanceOhmPerM, (v) => requireNonNegative(v, f('reactanceOhmPerM')));
  const maxVoltageDropPercent = optional(c.maxVoltageDropPercent, (v) => requireRange(v, f('maxVoltageDropPercent'), 0, 100, { minExclusive: true }));
  const windSpeedMPerS = c.windSpeedMPerS === undefined ? 0 : requireRange(c.windSpeedMPerS, f('windSpeedMPerS'), 0, 60);
  const groupingFactor =
    c.groupingFactor === undefined ? 1 : requireRange(c.groupingFactor, f('groupingFactor'), 0, 1, { minExclusive: true });
  const userLimitC = optional(c.temperatureLimitC, (v) => requireRange(v, f('temperatureLimitC'), -50, 1000));
  const surfaceCoefficientWPerM2K = optional(c.surfaceCoefficientWPerM2K, (v) =>
    requireRange(v, f('surfaceCoefficientWPerM2K'), 0, 1e5, { minExclusive: true }),
  );

  const inst = c.installation as Conditions['installation'] | undefined;
  if (!inst || typeof inst !== 'object') throw new ElectricalInputError(f('installation'), 'is required');
  let placement: PreparedConditions['placement'];
  let enclosureFactor = 1;
  let buried: PreparedConditions['buried'];
  switch (inst.kind) {
    case 'cable-in-air':
    case 'bar-on-edge':
    case 'bar-flat':
      placement = inst.kind;
      break;
    case 'buried': {
      placement = 'buried';
      const depthM = requirePositive(inst.depthM, f('installation.depthM'));
      const soilAssumed = inst.soilResistivityKmPerW === undefined;
      const soilResistivityKmPerW = soilAssumed
        ? DEFAULT_SOIL_RESISTIVITY_KM_PER_W
        : requireRange(inst.soilResistivityKmPerW, f('installation.soilResistivityKmPerW'), 0.1, 20);
      buried = { depthM, soilResistivityKmPerW, soilAssumed, groundAssumed: inst.groundC === undefined };
      break;
    }
    case 'enclosure':
      if (inst.inside !== 'cable-in-air' && inst.inside !== 'bar-on-edge' && inst.inside !== 'bar-flat') {
        throw new ElectricalInputError(f('installation.inside'), `must be 'cable-in-air', 'bar-on-edge' or 'bar-flat'`);
      }
      placement = inst.inside;
      enclosureFactor = requireRange(inst.deratingFactor, f('installation.deratingFactor'), 0, 1, { minExclusive: true });
      break;
    default:
      throw new ElectricalInputError(
        f('installation.kind'),
        `must be 'cable-in-air', 'bar-on-edge', 'bar-flat', 'buried' or 'enclosure' (got ${String((inst as { kind?: unknown }).kind)})`,
      );
  }
  const arrangement = inst as { formation?: unknown; spacingM?: unknown };
  const formation = arrangement.formation === undefined ? 'trefoil' : arrangement.formation;
  if (formation !== 'trefoil' && formation !== 'flat') {
    throw new ElectricalInputError(f('installation.formation'), `must be 'trefoil' or 'flat'`);
  }
  const spacingM = optional(arrangement.spacingM as number | undefined, (v) => requirePositive(v, f('installation.spacingM')));

  // Ambient: ground temperature for buried cables, air otherwise.
  let ambientC: number;
  let ambientAssumed = false;
  if (placement === 'buried') {
    const g = (inst as { groundC?: number }).groundC;
    if (g === undefined) {
      ambientC = DEFAULT_GROUND_C;
      ambientAssumed = true;
    } else ambientC = requireTemperature(g, f('installation.groundC'));
  } else if (c.ambientC === undefined) {
    ambientC = placement === 'cable-in-air' ? DEFAULT_AIR_AMBIENT_CABLE_C : DEFAULT_AIR_AMBIENT_BAR_C;
    ambientAssumed = true;
  } else {
    ambientC = requireRange(c.ambientC, f('ambientC'), -60, 200);
  }

  let solar: PreparedConditions['solar'];
  if (c.solar !== undefined) {
    const irradianceWPerM2 = requireRange(c.solar.irradianceWPerM2, f('solar.irradianceWPerM2'), 0, 1500);
    const absorptivityAssumed = c.solar.absorptivity === undefined;
    const absorptivity = absorptivityAssumed ? DEFAULT_SOLAR_ABSORPTIVITY : requireRange(c.solar.absorptivity, f('solar.absorptivity'), 0, 1);
    if (irradianceWPerM2 > 0) solar = { irradianceWPerM2, absorptivity, absorptivityAssumed };
  }
  if (solar && placement === 'buried') throw new ElectricalInputError(f('solar'), 'a buried cable receives no sun');
  if (windSpeedMPerS > 0 && placement === 'buried') throw new ElectricalInputError(f('windSpeedMPerS'), 'a buried cable is not cooled by wind');

  let fault: PreparedConditions['fault'];
  if (c.fault !== undefined) {
    const initialFrom = c.fault.initialFrom ?? 'limit';
    if (initialFrom !== 'limit' && initialFrom !== 'operating') {
      throw new ElectricalInputError(f('fault.initialFrom'), `must be 'limit' or 'operating'`);
    }
    fault = {
      currentA: requirePositive(c.fault.currentA, f('fault.currentA')),
      durationS: requireRange(c.fault.durationS, f('fault.durationS'), 0, 60, { minExclusive: true }),
      initialFrom,
    };
  }
  if (c.raiseMaterialLimit && userLimitC === undefined) {
    throw new ElectricalInputError(f('temperatureLimitC'), 'is required when raiseMaterialLimit is set');
  }

  let economics: EconomicsInputs | undefined;
  if (c.economics !== undefined) {
    const e = c.economics;
    requireRange(e.lossLoadFactor, f('economics.lossLoadFactor'), 0, 1);
    if (e.hoursPerYear !== undefined) requireRange(e.hoursPerYear, f('economics.hoursPerYear'), 0, 8784);
    toMoney(e.energyPricePerKWh, f('economics.energyPricePerKWh'));
    if (e.demandChargePerKWYear !== undefined) toMoney(e.demandChargePerKWYear, f('economics.demandChargePerKWYear'));
    if (e.loadGrowthPercent !== undefined) requireRange(e.loadGrowthPercent, f('economics.loadGrowthPercent'), -100, 100, { minExclusive: true });
    if (e.energyPriceGrowthPercent !== undefined) {
      requireRange(e.energyPriceGrowthPercent, f('economics.energyPriceGrowthPercent'), -100, 100, { minExclusive: true });
    }
    requireRange(e.discountRatePercent, f('economics.discountRatePercent'), -100, 100, { minExclusive: true });
    requireInteger(e.years, f('economics.years'), 0, 200);
    economics = e;
  }

  const prepared: PreparedConditions = {
    source: c,
    designCurrentA,
    frequencyHz,
    phases: c.phases,
    nominalVoltageV,
    lengthM,
    powerFactor,
    reactanceOhmPerM,
    maxVoltageDropPercent,
    ambientC,
    ambientAssumed,
    placement,
    enclosureFactor,
    groupingFactor,
    formation,
    spacingM,
    buried,
    windSpeedMPerS,
    solar,
    fault,
    userLimitC,
    raiseMaterialLimit: c.raiseMaterialLimit === true,
    surfaceCoefficientWPerM2K,
    economics,
  };
  if (flags) conditionFlags(prepared, flags);
  return prepared;
}

function conditionFlags(c: PreparedConditions, flags: FlagSet): void {
  if (c.ambientAssumed) {
    if (c.placement === 'buried') {
      flags.add('AMBIENT_ASSUMED', `No ground temperature was entered; ${c.ambientC} °C (the IEC 60364-5-52 reference ground temperature, from memory) was assumed.`, { ambientC: c.ambientC });
    } else {
      const basis = c.placement === 'cable-in-air' ? 'the IEC 60364-5-52 reference air temperature' : 'the IEC 61439-1 upper ambient for indoor assemblies';
      flags.add('AMBIENT_ASSUMED', `No ambient temperature was entered; ${c.ambientC} °C (${basis}, from memory) was assumed.`, { ambientC: c.ambientC });
    }
  }
  if (c.groupingFactor < 1) {
    flags.add('GROUPING_DERATING_ENTERED', `A grouping derating factor of ${fmt(c.groupingFactor)} was entered by the user and applied to the rating; its source must be checked.`, { factor: c.groupingFactor });
  }
  if (c.enclosureFactor < 1) {
    flags.add('ENCLOSURE_DERATING_ENTERED', `An enclosure derating factor of ${fmt(c.enclosureFactor)} was entered by the user and applied to the rating; the heating of the enclosure air is not computed.`, { factor: c.enclosureFactor });
  }
  if (c.surfaceCoefficientWPerM2K !== undefined) {
    flags.add('SURFACE_COEFFICIENT_ENTERED', `A fixed surface heat-transfer coefficient of ${fmt(c.surfaceCoefficientWPerM2K)} W/(m²·K) (convection and radiation together) was entered instead of the correlations.`, { h: c.surfaceCoefficientWPerM2K });
  }
  if (c.windSpeedMPerS > 0) {
    flags.add('WIND_COOLING_CREDITED', `Cooling by an air speed of ${fmt(c.windSpeedMPerS)} m/s is credited; in still air the conductor runs hotter.`, { windSpeedMPerS: c.windSpeedMPerS });
  }
  if (c.solar?.absorptivityAssumed) {
    flags.add('SOLAR_ABSORPTIVITY_ASSUMED', `The surface's solar absorptivity was not given; ${DEFAULT_SOLAR_ABSORPTIVITY} (the highest value in IEC 60287-2-1 Table 4, from memory) was assumed.`);
  }
  if (c.buried && (c.buried.soilAssumed || c.buried.groundAssumed)) {
    const parts: string[] = [];
    if (c.buried.soilAssumed) parts.push(`a soil thermal resistivity of ${DEFAULT_SOIL_RESISTIVITY_KM_PER_W} K·m/W`);
    if (c.buried.groundAssumed) parts.push(`a ground temperature of ${DEFAULT_GROUND_C} °C`);
    flags.add('BURIED_SOIL_ASSUMED', `Not entered, so assumed: ${parts.join(' and ')} (IEC 60364-5-52 reference conditions, from memory); site values may be worse.`);
  }
  if (c.fault === undefined) {
    flags.add('SHORT_CIRCUIT_NOT_CHECKED', 'No prospective fault current and clearing time were entered, so the short-circuit withstand was not checked.');
  } else if (c.fault.durationS > ADIABATIC_MAX_DURATION_S) {
    flags.add('SHORT_CIRCUIT_LONG_DURATION', `The fault lasts ${fmt(c.fault.durationS)} s, beyond the ${ADIABATIC_MAX_DURATION_S} s range of the adiabatic method; the computed final temperature over-estimates the real one (cautious).`);
  }
}

// ───────────────────────────── Candidates ─────────────────────────────

function limitOf(value: unknown, field: string): number | undefined {
  return value === undefined || value === null ? undefined : requireRange(value, field, -50, 1000);
}

export function prepareCandidate(
  candidate: Candidate,
  index: number,
  conditions: PreparedConditions,
  flags?: FlagSet,
): PreparedCandidate {
  const base = `candidates[${index}]`;
  const f = (name: string) => `${base}.${name}`;
  if (candidate === null || typeof candidate !== 'object') throw new ElectricalInputError(base, 'must be an object');
  const constants = materialConstants(candidate.material, f('material'));
  const alpha20 = candidate.alpha20PerK === undefined ? constants.alpha20PerK : requireRange(candidate.alpha20PerK, f('alpha20PerK'), 0, 0.01);
  const r20 = requireRange(candidate.r20OhmPerM, f('r20OhmPerM'), 0, 1, { minExclusive: true });
  const parallel = candidate.parallel === undefined ? 1 : requireInteger(candidate.parallel, f('parallel'), 1, 100);
  const id = candidate.id ?? `candidate-${index + 1}`;
  const user = conditions.userLimitC;
  const raise = conditions.raiseMaterialLimit;
  if (candidate.costs !== undefined) {
    if (candidate.costs.conductorPricePerKg !== undefined) toMoney(candidate.costs.conductorPricePerKg, f('costs.conductorPricePerKg'));
    if (candidate.costs.pricePerM !== undefined) toMoney(candidate.costs.pricePerM, f('costs.pricePerM'));
    if (candidate.costs.densityKgPerM3 !== undefined) requireRange(candidate.costs.densityKgPerM3, f('costs.densityKgPerM3'), 100, 25_000);
  }

  // Material limits in contact; the user's limit caps them, or replaces them when raised.
  const pickContact = (material: { c: number; source: LimitSource; layer?: string }[]): GoverningLimit => {
    const all = [...material];
    if (user !== undefined) {
      if (raise) {
        const exceeded = material.filter((m) => m.source !== 'terminal' && m.c < user);
        if (exceeded.length > 0 && flags) {
          const worst = exceeded.reduce((a, b) => (a.c < b.c ? a : b));
          flags.add('USER_LIMIT_ABOVE_RATING', `The user raised the temperature limit to ${fmt(user)} °C, above the ${fmt(worst.c)} °C rating of ${worst.layer ?? worst.source}; the raised rating needs the maker's evidence.`, { userLimitC: user, ratingC: worst.c });
        }
        for (let k = all.length - 1; k >= 0; k--) if (all[k].source !== 'terminal') all.splice(k, 1);
      }
      all.push({ c: user, source: 'user' });
    }
    if (all.length === 0) {
      throw new ElectricalInputError(
        f(candidate.kind === 'bar' ? 'terminalLimitC' : 'layers[0].continuousLimitC'),
        'no temperature limit is known: give the covering or terminal limit, or a user limit',
      );
    }
    const min = all.reduce((a, b) => (b.c < a.c ? b : a));
    return min.layer === undefined ? { temperatureC: min.c, source: min.source } : { temperatureC: min.c, source: min.source, layer: min.layer };
  };

  const memory = candidate.dataFromMemory === true || (candidate.sourceNotes ?? []).some((n) => /from memory/i.test(String(n)));
  if (memory && flags) {
    flags.add('DATA_FROM_MEMORY', `Some data of ${candidate.label ?? id} were entered from memory rather than read from a datasheet or standard; check them against the source.`);
  }

  if (candidate.kind === 'cable') return prepareCable(candidate, { index, id, constants, alpha20, r20, parallel, f, pickContact, conditions, flags, raise, user });
  if (candidate.kind === 'bar') return prepareBar(candidate, { index, id, constants, alpha20, r20, parallel, f, pickContact, conditions, flags, raise, user });
  throw new ElectricalInputError(f('kind'), `must be 'cable' or 'bar' (got ${String((candidate as { kind?: unknown }).kind)})`);
}

interface CommonPrep {
  index: number;
  id: string;
  constants: Readonly<ConductorMaterialConstants>;
  alpha20: number;
  r20: number;
  parallel: number;
  f: (name: string) => string;
  pickContact: (m: { c: number; source: LimitSource; layer?: string }[]) => GoverningLimit;
  conditions: PreparedConditions;
  flags?: FlagSet;
  raise: boolean;
  user?: number;
}

function prepareCable(cand: CableCandidate, p: CommonPrep): PreparedCandidate {
  const { f, conditions } = p;
  if (conditions.placement === 'bar-on-edge' || conditions.placement === 'bar-flat') {
    throw new ElectricalInputError('conditions.installation.kind', `a cable cannot be installed as '${conditions.placement}'`);
  }
  const sectionMm2 = requireRange(cand.sectionMm2, f('sectionMm2'), 0, 5000, { minExclusive: true });
  const dc = requireRange(cand.conductorDiameterM, f('conductorDiameterM'), 0, 0.2, { minExclusive: true });
  const cores = cand.cores === undefined ? 1 : requireInteger(cand.cores, f('cores'), 1, 5);
  if (!Array.isArray(cand.layers) || cand.layers.length === 0) {
    throw new ElectricalInputError(f('layers'), 'a cable needs at least its insulation layer');
  }
  const emissivityAssumed = cand.emissivity === undefined;
  const emissivity = emissivityAssumed ? DEFAULT_CABLE_EMISSIVITY : requireRange(cand.emissivity, f('emissivity'), 0, 1);
  if (cand.ks !== undefined) requireRange(cand.ks, f('ks'), 0, 1.5, { minExclusive: true });
  if (cand.kp !== undefined) requireRange(cand.kp, f('kp'), 0, 1.5, { minExclusive: true });

  const layers: PreparedLayer[] = [];
  let hasMetallicLayer = false;
  let scLimit: number | undefined;
  cand.layers.forEach((l, k) => {
    const lf = (n: string) => f(`layers[${k}].${n}`);
    if (l === null || typeof l !== 'object') throw new ElectricalInputError(f(`layers[${k}]`), 'must be an object');
    const thicknessM = requireRange(l.thicknessM, lf('thicknessM'), 0, 0.5, { minExclusive: true });
    const rhoT = requireRange(l.thermalResistivityKmPerW, lf('thermalResistivityKmPerW'), 0, 1e4, { minExclusive: true });
    const limit = limitOf(l.continuousLimitC, lf('continuousLimitC'));
    const sc = limitOf(l.shortCircuitLimitC, lf('shortCircuitLimitC'));
    if (k === 0 && sc !== undefined) scLimit = sc;
    if (l.role === 'screen' || l.role === 'armour') hasMetallicLayer = true;
    layers.push({
      name: typeof l.name === 'string' && l.name.trim() ? l.name : `layer ${k + 1}`,
      role: l.role ?? (k === 0 ? 'insulation' : 'other'),
      thicknessM,
      conductivityWPerMK: 1 / rhoT,
      generating: false,
      limitC: limit,
      contact: k === 0,
    });
  });
  // A conductor-screen layer without a limit passes "contact" to the next layer with one.
  const contactIndex = layers.findIndex((l) => l.limitC !== undefined);
  const contactMaterial: { c: number; source: LimitSource; layer?: string }[] = [];
  if (contactIndex >= 0) {
    const l = layers[contactIndex];
    contactMaterial.push({ c: l.limitC as number, source: 'insulation', layer: l.name });
    for (let k = 0; k <= contactIndex; k++) layers[k].contact = true;
  }
  if (scLimit === undefined && contactIndex >= 0) scLimit = limitOf(cand.layers[contactIndex].shortCircuitLimitC, f(`layers[${contactIndex}].shortCircuitLimitC`));
  const contactLimit = p.pickContact(contactMaterial);
  // Outer layers keep their own limits; a raised user limit replaces covering ratings everywhere.
  for (const l of layers) {
    if (l.contact) l.limitC = undefined;
    else if (p.raise && l.limitC !== undefined && p.user !== undefined) {
      if (l.limitC < p.user && p.flags) {
        p.flags.add('USER_LIMIT_ABOVE_RATING', `The user raised the temperature limit to ${fmt(p.user)} °C, above the ${fmt(l.limitC)} °C rating of ${l.name}; the raised rating needs the maker's evidence.`, { userLimitC: p.user, ratingC: l.limitC });
      }
      l.limitC = undefined;
    } else if (l.limitC !== undefined && p.user !== undefined) l.limitC = Math.min(l.limitC, p.user);
  }

  const loadedCores = cores === 1 ? 1 : Math.min(cores, conditions.phases === 3 ? 3 : 2);
  const equivalentDiameter = dc * Math.sqrt(loadedCores);
  const outerDiameterM = equivalentDiameter + 2 * layers.reduce((s, l) => s + l.thicknessM, 0);
  if (conditions.buried && conditions.buried.depthM <= outerDiameterM / 2) {
    throw new ElectricalInputError('conditions.installation.depthM', `the cable axis must be deeper than its radius (${fmt(outerDiameterM / 2)} m)`);
  }

  const flags = p.flags;
  if (flags) {
    if (emissivityAssumed && conditions.surfaceCoefficientWPerM2K === undefined && conditions.placement !== 'buried') {
      flags.add('EMISSIVITY_ASSUMED', `The cable surface emissivity was not given; ${DEFAULT_CABLE_EMISSIVITY} (common for PVC and PE jackets) was assumed.`);
    }
    if (cores > 1) {
      flags.add('MULTICORE_APPROXIMATION', `This ${cores}-core cable is modelled as one round conductor of the ${loadedCores} loaded cores' total section inside the listed coverings; the real heat path between cores differs (IEC 60287-2-1 uses a geometric factor).`, { cores, loadedCores });
    }
    if (hasMetallicLayer && conditions.frequencyHz > 0) {
      flags.add('SHEATH_LOSSES_NOT_INCLUDED', 'The cable has a metallic screen or armour; currents induced in it (IEC 60287-1-1 loss factors λ₁, λ₂) are not included, which is optimistic for single-core cables bonded at both ends.');
    }
    if (p.parallel > 1) {
      flags.add('PARALLEL_SHARING_ASSUMED', `The current is assumed to divide equally between the ${p.parallel} parallel cables of each phase; this needs equal lengths and a symmetrical layout.`, { parallel: p.parallel });
    }
    const cablesNear = (cores === 1 ? (conditions.phases === 3 ? 3 : 2) : 1) * p.parallel;
    if (cablesNear > 1 && conditions.groupingFactor === 1 && conditions.enclosureFactor === 1) {
      const spacing = conditions.spacingM;
      if (spacing === undefined || spacing < 2 * outerDiameterM) {
        flags.add('MUTUAL_HEATING_NOT_MODELLED', `The ${cablesNear} cables of this circuit lie ${spacing === undefined ? 'touching (no spacing entered)' : `${fmt(spacing)} m apart (axis to axis), closer than two diameters`}, but each is modelled alone and no grouping factor was entered; they heat one another.`, { cables: cablesNear });
      }
    }
  }

  const perConductor = sectionMm2;
  const conductorsPerPhase = p.parallel;
  return {
    index: p.index,
    id: p.id,
    label: cand.label ?? p.id,
    kind: 'cable',
    source: cand,
    material: cand.material,
    constants: p.constants,
    alpha20: p.alpha20,
    r20: p.r20,
    conductorsPerPhase,
    parallel: p.parallel,
    barsPerPhase: 1,
    sectionPerConductorMm2: perConductor,
    sectionPerPhaseMm2: perConductor * conductorsPerPhase,
    cores,
    loadedCores,
    contactLimit,
    layers,
    emissivity,
    conductorDiameterM: dc,
    outerDiameterM,
    shortCircuitLimitC: scLimit,
    hasMetallicLayer,
  };
}

function prepareBar(cand: BarCandidate, p: CommonPrep): PreparedCandidate {
  const { f, conditions } = p;
  if (conditions.placement === 'buried' || conditions.placement === 'cable-in-air') {
    throw new ElectricalInputError('conditions.installation.kind', `a bus bar cannot be installed as '${conditions.placement}'`);
  }
  const widthM = requireRange(cand.widthM, f('widthM'), 0, 1, { minExclusive: true });
  const thicknessM = requireRange(cand.thicknessM, f('thicknessM'), 0, 0.2, { minExclusive: true });
  const barsPerPhase = cand.barsPerPhase === undefined ? 1 : requireInteger(cand.barsPerPhase, f('barsPerPhase'), 1, 20);
  if (cand.barGapM !== undefined) requireNonNegative(cand.barGapM, f('barGapM'));
  if (cand.acResistanceRatio !== undefined) requireRange(cand.acResistanceRatio, f('acResistanceRatio'), 1, 10);
  const terminal = limitOf(cand.terminalLimitC, f('terminalLimitC'));
  const contactMaterial: { c: number; source: LimitSource; layer?: string }[] = [];
  const layers: PreparedLayer[] = [];
  let emissivity: number;
  let emissivityAssumed: boolean;
  let scLimit = limitOf(cand.shortCircuitLimitC, f('shortCircuitLimitC'));
  if (cand.coating !== undefined) {
    const c = cand.coating;
    const cf = (n: string) => f(`coating.${n}`);
    const name = c.name && c.name.trim() ? c.name : 'coating';
    const coatingLimit = limitOf(c.continuousLimitC, cf('continuousLimitC'));
    const coatingSc = limitOf(c.shortCircuitLimitC, cf('shortCircuitLimitC'));
    if (coatingSc !== undefined) scLimit = scLimit === undefined ? coatingSc : Math.min(scLimit, coatingSc);
    layers.push({
      name,
      role: 'coating',
      thicknessM: requireRange(c.thicknessM, cf('thicknessM'), 0, 0.05, { minExclusive: true }),
      conductivityWPerMK: 1 / requireRange(c.thermalResistivityKmPerW, cf('thermalResistivityKmPerW'), 0, 1e4, { minExclusive: true }),
      generating: false,
      contact: true,
    });
    if (coatingLimit !== undefined) contactMaterial.push({ c: coatingLimit, source: 'coating', layer: name });
    emissivityAssumed = c.emissivity === undefined;
    emissivity = emissivityAssumed ? DEFAULT_COATED_BAR_EMISSIVITY : requireRange(c.emissivity, cf('emissivity'), 0, 1);
  } else {
    emissivityAssumed = cand.emissivity === undefined;
    emissivity = emissivityAssumed ? DEFAULT_BARE_BAR_EMISSIVITY : requireRange(cand.emissivity, f('emissivity'), 0, 1);
  }
  if (terminal !== undefined) contactMaterial.push({ c: terminal, source: 'terminal' });
  const contactLimit = p.pickContact(contactMaterial);

  const flags = p.flags;
  if (flags) {
    if (emissivityAssumed && conditions.surfaceCoefficientWPerM2K === undefined) {
      flags.add('EMISSIVITY_ASSUMED', cand.coating
        ? `The coating's emissivity was not given; ${DEFAULT_COATED_BAR_EMISSIVITY} (common for paints) was assumed.`
        : `The bar's emissivity was not given; ${DEFAULT_BARE_BAR_EMISSIVITY} (bright metal, the cautious end) was assumed.`);
    }
    flags.add('BAR_EDGES_LUMPED', `The heat leaving the bar's narrow edges is lumped onto its wide faces by scaling their area by (w + t)/w = ${fmt((widthM + thicknessM) / widthM, 4)}.`);
    if (barsPerPhase > 1) {
      flags.add('MULTI_BAR_INNER_FACES', `Each of the ${barsPerPhase} bars per phase is modelled with both faces free, and the current is assumed to divide equally; inner faces of a pack lose less heat and AC current crowds into the outer bars, so the real pack runs hotter.`, { barsPerPhase });
    }
    if (p.parallel > 1) {
      flags.add('PARALLEL_SHARING_ASSUMED', `The current is assumed to divide equally between the ${p.parallel} parallel runs of each phase; this needs equal impedances.`, { parallel: p.parallel });
    }
    if (cand.acResistanceRatio !== undefined && conditions.frequencyHz > 0) {
      flags.add('AC_FACTOR_USER_ENTERED', `R_ac/R_dc = ${fmt(cand.acResistanceRatio, 4)} was entered from the bar maker's data.`, { ratio: cand.acResistanceRatio });
    }
    if (conditions.reactanceOhmPerM === undefined) {
      flags.add('BAR_REACTANCE_ASSUMED', "The voltage drop uses Annex G's cable reactance of 0.08 mΩ/m; a bus bar's reactance depends on its phase spacing and is often higher — enter the maker's value.");
    }
  }
  const perConductor = widthM * thicknessM * 1e6;
  const conductorsPerPhase = p.parallel * barsPerPhase;
  return {
    index: p.index,
    id: p.id,
    label: cand.label ?? p.id,
    kind: 'bar',
    source: cand,
    material: cand.material,
    constants: p.constants,
    alpha20: p.alpha20,
    r20: p.r20,
    conductorsPerPhase,
    parallel: p.parallel,
    barsPerPhase,
    sectionPerConductorMm2: perConductor,
    sectionPerPhaseMm2: perConductor * conductorsPerPhase,
    cores: 1,
    loadedCores: 1,
    contactLimit,
    layers,
    emissivity,
    widthM,
    thicknessM,
    shortCircuitLimitC: scLimit,
    hasMetallicLayer: false,
  };
}

