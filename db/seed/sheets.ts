/**
 * Demo sizing sheets for the invented Kestrel Yard project, one in each review state, made through
 * the same query functions the app uses (so each has a real server snapshot and an audit history).
 * Idempotent: a sheet whose circuit tag already exists in the project is left alone.
 *
 * Conductor data are typical values recalled from memory (IEC 60228 maximum DC resistances,
 * IEC 60502-1 insulation thicknesses, IEC 60287-2-1 Table 1 thermal resistivities), marked so:
 * each candidate carries a "from memory" source note, which raises the DATA_FROM_MEMORY flag for
 * the reviewer — as it should for demo data.
 */
import { and, eq } from 'drizzle-orm';
import type { Db } from '../client';
import { projects, sheets, teams, users } from '../schema';
import {
  acknowledgeFlag,
  createSheet,
  getSheet,
  transitionSheet,
} from '../queries/sheets';
import { defaultSheetInputs, type Actor, type SheetCandidate, type SheetInputs } from '../../lib/sheet';
import type { SheetDevice, SheetProtection } from '../../lib/sheet/systemSchema';
import { can, type Role } from '../../lib/auth/permissions';
import { DEMO_PROJECT, DEMO_TEAM, DEMO_USERS } from './demo';

const MEMORY_NOTE = 'Typical values from memory (IEC 60228, IEC 60502-1, IEC 60287-2-1 Table 1); check against the maker’s data sheet.';
/** IEC 60028 resistivity of annealed copper at 20 °C, 1/58 Ω·mm²/m. */
const COPPER_RHO20_OHM_M = 1 / 58e6;

function copperBar(id: string, widthMm: number, thicknessMm: number, barsPerPhase: number): SheetCandidate {
  const areaM2 = (widthMm * thicknessMm) / 1e6;
  return {
    id,
    label: `${barsPerPhase} × ${widthMm} × ${thicknessMm} mm copper bar`,
    kind: 'bar',
    material: 'copper',
    r20OhmPerM: COPPER_RHO20_OHM_M / areaM2,
    parallel: 1,
    widthM: widthMm / 1000,
    thicknessM: thicknessMm / 1000,
    barsPerPhase,
    barGapM: thicknessMm / 1000,
    // Joints of bare copper bars are commonly held to about 105 °C (common practice).
    terminalLimitC: 105,
    shortCircuitLimitC: 200,
    sourceNotes: ['Resistance from the IEC 60028 copper resistivity 1/58 Ω·mm²/m.', `Joint limit 105 °C and short-circuit limit 200 °C: ${MEMORY_NOTE}`],
    costs: { conductorPricePerKg: '9.50' },
  };
}

interface CableSpec {
  id: string;
  material: 'copper' | 'aluminium';
  sectionMm2: number;
  r20OhmPerKm: number;
  conductorDiameterMm: number;
  insulation: 'XLPE' | 'PVC';
  insulationMm: number;
  sheathMm: number;
  parallel: number;
  pricePerM: string;
}

function singleCore(spec: CableSpec): SheetCandidate {
  const xlpe = spec.insulation === 'XLPE';
  const metal = spec.material === 'copper' ? 'Cu' : 'Al';
  return {
    id: spec.id,
    label: `${spec.parallel > 1 ? `${spec.parallel} × ` : ''}${spec.sectionMm2} mm² ${metal} ${spec.insulation} single-core`,
    kind: 'cable',
    material: spec.material,
    r20OhmPerM: spec.r20OhmPerKm / 1000,
    sectionMm2: spec.sectionMm2,
    conductorDiameterM: spec.conductorDiameterMm / 1000,
    parallel: spec.parallel,
    layers: [
      {
        name: `${spec.insulation} insulation`,
        role: 'insulation',
        thicknessM: spec.insulationMm / 1000,
        thermalResistivityKmPerW: xlpe ? 3.5 : 5.0,
        continuousLimitC: xlpe ? 90 : 70,
        shortCircuitLimitC: xlpe ? 250 : 160,
      },
      { name: 'PVC sheath', role: 'sheath', thicknessM: spec.sheathMm / 1000, thermalResistivityKmPerW: 5.0 },
    ],
    sourceNotes: [`Conductor, insulation and sheath data: ${MEMORY_NOTE}`],
    dataFromMemory: true,
    costs: { pricePerM: spec.pricePerM },
  };
}

/**
 * The demo's protective devices (invented, no maker's data): the kinds of IEC 60898-1, IEC 60947-2
 * and IEC 60269 with a rating and, for adjustable breakers, settings a designer would pick.
 */
function device(overrides: Partial<SheetDevice> & Pick<SheetDevice, 'kind' | 'ratedCurrentA'>): SheetDevice {
  return { curve: 'C', settingCurrentA: null, settingStepsA: [], instantaneousCurrentA: null, instantaneousMaxTimeS: null, conventionalOperatingCurrentA: null, timeCurrentCurve: [], ...overrides };
}

function protectionOf(inputs: SheetInputs, change: Partial<SheetProtection> & Pick<SheetProtection, 'device'>): SheetProtection {
  return { ...inputs.protection, included: true, ...change };
}

interface DemoSheet {
  circuitTag: string;
  title: string;
  inputs: SheetInputs;
  state: 'draft' | 'in_review' | 'returned' | 'approved';
  returnComment?: string;
}

function busBarRun(): DemoSheet {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 2500, lengthM: 12, powerFactor: 0.9, maxVoltageDropPercent: 1, reactanceOhmPerM: null };
  inputs.fault = { checked: true, currentA: 50000, durationS: 1 };
  inputs.environment = { ...inputs.environment, ambientC: 35 };
  inputs.candidates = [copperBar('cu-bar-2x100x10', 100, 10, 2), copperBar('cu-bar-2x120x10', 120, 10, 2), copperBar('cu-bar-3x100x10', 100, 10, 3)];
  inputs.chosenCandidateId = 'cu-bar-2x100x10';
  // The run as built (issue 18): packs of two bars on edge 10 mm apart, phases 250 mm apart, on
  // supports every 500 mm continuous over the run with a spacer midway; the invented supports are
  // rated 20 kN. R/X 0.1 at the transformer's terminals (common practice for large LV transformers).
  inputs.busbarSystem = {
    ...inputs.busbarSystem,
    barGapM: 0.01,
    phaseSpacingM: 0.25,
    supportSpacingM: 0.5,
    spacerSpacingM: 0.25,
    supports: 'continuous-three-or-more-spans',
    supportStrengthN: 20000,
    peakFactorBy: 'r-over-x',
    rOverX: 0.1,
  };
  // The transformer's incoming breaker (IEC 60947-2), its trip unit set to 2500 A; the source is the
  // transformer (2 MVA, about 6 % impedance: R ≈ 0.8 mΩ, X ≈ 4.7 mΩ on 400 V, common practice).
  inputs.protection = protectionOf(inputs, {
    device: device({ kind: 'breaker-iec60947-2', ratedCurrentA: 2500, settingCurrentA: 2500, instantaneousCurrentA: 20000, settingStepsA: [1000, 1250, 1600, 2000, 2500] }),
    circuitRole: 'distribution',
    sourceBy: 'r-and-x',
    sourceResistanceOhm: 0.0008,
    sourceReactanceOhm: 0.0047,
  });
  inputs.notes = 'Transformer T1 to the main switchboard, busway in the switchroom (demo).';
  return { circuitTag: 'KY-T1-MSB', title: 'Transformer T1 to main switchboard, bus-bar run', inputs, state: 'approved' };
}

function chillerFeeder(): DemoSheet {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 630, lengthM: 85 };
  inputs.fault = { checked: true, currentA: 30000, durationS: 0.2 };
  inputs.environment = { ...inputs.environment, ambientC: 35 };
  // Two runs per phase for the smaller sizes: each run a touching trefoil, the runs 150 mm apart
  // centre to centre on the ladder (about four cable diameters, so more than two diameters clear).
  inputs.installation = { ...inputs.installation, formation: 'trefoil', spacingM: null, circuitSpacingM: 0.15, circuitRow: 'horizontal' };
  inputs.candidates = [
    singleCore({ id: 'cu-xlpe-2x185', material: 'copper', sectionMm2: 185, r20OhmPerKm: 0.0991, conductorDiameterMm: 15.9, insulation: 'XLPE', insulationMm: 1.6, sheathMm: 1.8, parallel: 2, pricePerM: '38.00' }),
    singleCore({ id: 'cu-xlpe-2x240', material: 'copper', sectionMm2: 240, r20OhmPerKm: 0.0754, conductorDiameterMm: 18.0, insulation: 'XLPE', insulationMm: 1.7, sheathMm: 1.9, parallel: 2, pricePerM: '49.00' }),
    singleCore({ id: 'cu-xlpe-1x400', material: 'copper', sectionMm2: 400, r20OhmPerKm: 0.047, conductorDiameterMm: 23.2, insulation: 'XLPE', insulationMm: 2.0, sheathMm: 2.1, parallel: 1, pricePerM: '82.00' }),
  ];
  inputs.chosenCandidateId = 'cu-xlpe-2x185';
  // A moulded-case breaker with an adjustable trip unit; the protective conductor a separate 185 mm² copper XLPE core run with the phases.
  inputs.protection = protectionOf(inputs, {
    device: device({ kind: 'breaker-iec60947-2', ratedCurrentA: 800, settingCurrentA: 630, instantaneousCurrentA: 3150, settingStepsA: [320, 400, 500, 630, 800] }),
    circuitRole: 'distribution',
    sourceBy: 'r-and-x',
    sourceResistanceOhm: 0.002,
    sourceReactanceOhm: 0.008,
    protectiveConductor: { entered: true, sectionMm2: 185, material: 'copper', insulation: 'thermosetting-90', arrangement: 'in-cable-or-bunched' },
  });
  inputs.notes = 'Main switchboard to chiller plant CH-1 on the cable ladder in the plant room (demo).';
  return { circuitTag: 'KY-MSB-CH1', title: 'Chiller plant feeder', inputs, state: 'in_review' };
}

function evFeeder(): DemoSheet {
  const inputs = defaultSheetInputs('buried');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 250, lengthM: 140, maxVoltageDropPercent: 3 };
  inputs.fault = { checked: true, currentA: 12000, durationS: 0.4 };
  // In the same trench as the feeder to the second charger pillar (same cable, 120 A), 300 mm apart.
  inputs.installation = {
    ...inputs.installation,
    depthM: 0.8,
    soilResistivityKmPerW: null,
    groundC: 15,
    formation: 'trefoil',
    spacingM: null,
    otherCircuits: [{ label: 'EV charger pillar 2 feeder', currentA: 120, sameCable: true, externalDiameterM: null, lossWPerM: null }],
    circuitSpacingM: 0.3,
    circuitRow: 'horizontal',
  };
  inputs.economics = { ...inputs.economics, included: true, lossLoadFactor: 0.35, energyPricePerKWh: '0.18', years: 20 };
  inputs.candidates = [
    singleCore({ id: 'al-xlpe-150', material: 'aluminium', sectionMm2: 150, r20OhmPerKm: 0.206, conductorDiameterMm: 14.0, insulation: 'XLPE', insulationMm: 1.4, sheathMm: 1.8, parallel: 1, pricePerM: '9.50' }),
    singleCore({ id: 'al-xlpe-185', material: 'aluminium', sectionMm2: 185, r20OhmPerKm: 0.164, conductorDiameterMm: 15.9, insulation: 'XLPE', insulationMm: 1.6, sheathMm: 1.8, parallel: 1, pricePerM: '11.20' }),
    singleCore({ id: 'al-xlpe-240', material: 'aluminium', sectionMm2: 240, r20OhmPerKm: 0.125, conductorDiameterMm: 18.0, insulation: 'XLPE', insulationMm: 1.7, sheathMm: 1.9, parallel: 1, pricePerM: '14.10' }),
  ];
  // The smaller sections fail (heating, voltage drop, overload coordination): only a passing choice may be submitted (issue 22).
  inputs.chosenCandidateId = 'al-xlpe-240';
  inputs.protection = protectionOf(inputs, { device: device({ kind: 'breaker-iec60947-2', ratedCurrentA: 400, settingCurrentA: 250, instantaneousCurrentA: 2500, settingStepsA: [160, 200, 250, 320, 400] }), circuitRole: 'distribution' });
  inputs.notes = 'Main switchboard to the EV charger pillar across the yard, direct in ground, in one trench with the pillar 2 feeder (demo).';
  return {
    circuitTag: 'KY-MSB-EV1',
    title: 'EV charger feeder across the yard',
    inputs,
    state: 'returned',
    returnComment: 'Soil resistivity is assumed; get the site survey value, the 240 mm² margin depends on it. Also check the voltage drop at full charger load.',
  };
}

function refrigerationFeeder(): DemoSheet {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 160, lengthM: 45 };
  inputs.fault = { checked: true, currentA: 8000, durationS: 0.4 };
  inputs.environment = { ...inputs.environment, ambientC: 35, outdoorSun: true, irradianceWPerM2: 1000, solarAbsorptivity: null };
  // A flat row of touching single cores on the roof tray, nothing else on that tray.
  inputs.installation = { ...inputs.installation, formation: 'flat', spacingM: null };
  inputs.candidates = [
    singleCore({ id: 'cu-pvc-50', material: 'copper', sectionMm2: 50, r20OhmPerKm: 0.387, conductorDiameterMm: 8.2, insulation: 'PVC', insulationMm: 1.4, sheathMm: 1.6, parallel: 1, pricePerM: '9.80' }),
    singleCore({ id: 'cu-xlpe-70', material: 'copper', sectionMm2: 70, r20OhmPerKm: 0.268, conductorDiameterMm: 9.8, insulation: 'XLPE', insulationMm: 1.1, sheathMm: 1.6, parallel: 1, pricePerM: '14.60' }),
  ];
  inputs.chosenCandidateId = null;
  // gG fuses at the board; their curve is not entered, so only the coordination is checked.
  inputs.protection = protectionOf(inputs, { device: device({ kind: 'fuse-gG-iec60269', ratedCurrentA: 160 }), circuitRole: 'distribution' });
  inputs.notes = 'Roof plant: main switchboard to refrigeration rack R-2, cable tray in full sun (demo).';
  return { circuitTag: 'KY-MSB-RR2', title: 'Refrigeration rack feeder on the roof', inputs, state: 'draft' };
}

/** A draft that shows the optional checks: a riser in a closed switchboard section, its overload and day, and its joints. */
function distributionRiser(): DemoSheet {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 1000, lengthM: 4, maxVoltageDropPercent: 1 };
  inputs.fault = { checked: true, currentA: 35000, durationS: 0.5 };
  inputs.environment = { ...inputs.environment, ambientC: 40 };
  inputs.candidates = [copperBar('cu-bar-1x60x10', 60, 10, 1), copperBar('cu-bar-1x80x10', 80, 10, 1)];
  inputs.chosenCandidateId = 'cu-bar-1x60x10';
  // Risers 150 mm apart on supports every 600 mm; the section's breaker, set to 1000 A.
  inputs.busbarSystem = { ...inputs.busbarSystem, phaseSpacingM: 0.15, supportSpacingM: 0.6, supports: 'continuous-three-or-more-spans', peakFactorBy: 'r-over-x', rOverX: 0.15 };
  inputs.protection = protectionOf(inputs, { device: device({ kind: 'breaker-iec60947-2', ratedCurrentA: 1250, settingCurrentA: 1000, instantaneousCurrentA: 10000, settingStepsA: [630, 800, 1000, 1250] }), circuitRole: 'distribution' });
  // Invented operating pattern of the demo building: shops open 08:00–20:00.
  const dailyProfileA = Array.from({ length: 24 }, (_, hour) => (hour >= 8 && hour < 20 ? 950 : 420));
  inputs.overTime = { checked: true, overloadCurrentA: 1300, overloadDurationS: 1800, dailyProfileA, faultWithCoverings: true };
  inputs.alongRun = {
    checked: true,
    lengthM: 4,
    startEnd: 'terminal',
    startTemperatureC: 70,
    endEnd: 'terminal',
    endTemperatureC: 70,
    joints: [{ positionM: 2, resistanceMicroOhm: null }],
  };
  inputs.enclosureAir = { ...inputs.enclosureAir, checked: true, heightM: 2.2, widthM: 0.8, depthM: 0.6, backCovered: true, sidesCovered: 1, outsideAirC: 30, routeLengthInsideM: 4, otherLossesW: 350 };
  inputs.notes = 'Main switchboard section 3 riser to the distribution bars, in a closed section of the board (demo).';
  return { circuitTag: 'KY-MSB-DB3', title: 'Switchboard section 3 riser', inputs, state: 'draft' };
}

export function demoSheets(): DemoSheet[] {
  return [busBarRun(), chillerFeeder(), evFeeder(), refrigerationFeeder(), distributionRiser()];
}

function actorOf(user: { id: string; role: Role }): Actor {
  return { userId: user.id, can: (permission) => can(user.role, permission) };
}

export async function seedSheets(db: Db): Promise<{ sheetsCreated: number }> {
  const [team] = await db.select().from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  if (!team) return { sheetsCreated: 0 };
  const [project] = await db.select().from(projects).where(and(eq(projects.teamId, team.id), eq(projects.name, DEMO_PROJECT.name)));
  const [designer] = await db.select().from(users).where(eq(users.email, DEMO_USERS[1].email));
  const [reviewer] = await db.select().from(users).where(eq(users.email, DEMO_USERS[2].email));
  if (!project || !designer || !reviewer) return { sheetsCreated: 0 };
  const designerActor = actorOf(designer);
  const reviewerActor = actorOf(reviewer);
  let sheetsCreated = 0;
  for (const demo of demoSheets()) {
    const existing = await db
      .select({ id: sheets.id })
      .from(sheets)
      .where(and(eq(sheets.projectId, project.id), eq(sheets.circuitTag, demo.circuitTag)));
    if (existing.length > 0) continue;
    const created = await createSheet(team.id, designerActor, { projectId: project.id, circuitTag: demo.circuitTag, title: demo.title, inputs: demo.inputs });
    sheetsCreated += 1;
    if (demo.state === 'draft') continue;
    await transitionSheet(team.id, designerActor, created.id, 'submit');
    if (demo.state === 'in_review') continue;
    if (demo.state === 'returned') {
      await transitionSheet(team.id, reviewerActor, created.id, 'return', { comment: demo.returnComment });
      continue;
    }
    const sheet = await getSheet(team.id, created.id);
    for (const flag of sheet?.result?.chosenFlags ?? []) {
      if (flag.severity !== 'review') continue;
      await acknowledgeFlag(team.id, reviewerActor, created.id, flag.code, `Accepted for the demo: “${flag.title}” checked against the switchroom drawings (demo comment).`);
    }
    await transitionSheet(team.id, reviewerActor, created.id, 'approve', { comment: 'Checked against the switchroom drawings (demo).' });
  }
  return { sheetsCreated };
}

// Re-exported for tests that want the same candidates.
export { copperBar as demoCopperBar, singleCore as demoSingleCore };
