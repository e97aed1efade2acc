/**
 * Every sentence the steady sizing raises as an assumption flag, in one place: a reviewer reads
 * these words, so they are written once and kept consistent. Each function takes the numbers
 * the sentence needs and returns the message; `flags.ts` holds the codes, severities and titles.
 */
import { fmt } from './flags';

export const DEFAULT_TEXT = {
  groundAmbient: (c: number) =>
    `No ground temperature was entered; ${c} °C (the IEC 60364-5-52 reference ground temperature, from memory) was assumed.`,
  airAmbient: (c: number, basis: string) => `No ambient temperature was entered; ${c} °C (${basis}, from memory) was assumed.`,
  soil: (parts: string[]) =>
    `Not entered, so assumed: ${parts.join(' and ')} (IEC 60364-5-52 reference conditions, from memory); site values may be worse.`,
  cableEmissivity: (e: number) => `The cable surface emissivity was not given; ${e} (common for PVC and PE jackets) was assumed.`,
  coatingEmissivity: (e: number) => `The coating's emissivity was not given; ${e} (common for paints) was assumed.`,
  bareBarEmissivity: (e: number) => `The bar's emissivity was not given; ${e} (bright metal, the cautious end) was assumed.`,
  solarAbsorptivity: (a: number) =>
    `The surface's solar absorptivity was not given; ${a} (the highest value in IEC 60287-2-1 Table 4, from memory) was assumed.`,
  proximitySpacing: (spacingM: number) =>
    `No cable spacing was entered; for the proximity effect the cables are taken as touching (axis spacing ${fmt(spacingM)} m), the cautious case.`,
  reactance: () => 'The voltage drop uses the Annex G default reactance of 0.08 mΩ/m per run.',
  barReactance: () =>
    "The voltage drop uses Annex G's cable reactance of 0.08 mΩ/m; a bus bar's reactance depends on its phase spacing and is often higher — enter the maker's value.",
} as const;

export const ENTERED_TEXT = {
  grouping: (factor: number) =>
    `A grouping derating factor of ${fmt(factor)} was entered by the user and applied to the rating; its source must be checked.`,
  enclosure: (factor: number) =>
    `An enclosure derating factor of ${fmt(factor)} was entered by the user and applied to the rating; the heating of the enclosure air is not computed.`,
  surfaceCoefficient: (h: number) =>
    `A fixed surface heat-transfer coefficient of ${fmt(h)} W/(m²·K) (convection and radiation together) was entered instead of the correlations.`,
  wind: (speed: number) => `Cooling by an air speed of ${fmt(speed)} m/s is credited; in still air the conductor runs hotter.`,
  userLimitAboveRating: (userC: number, ratingC: number, what: string, justification?: string) =>
    `The user raised the temperature limit to ${fmt(userC)} °C, above the ${fmt(ratingC)} °C rating of ${what}; the raised rating needs the maker's evidence.${justification ? ` The designer's justification: “${justification}”.` : ''}`,
  userLimitNotJustified: (userC: number, ratingC: number) =>
    `The limit of ${fmt(userC)} °C replaces a ${fmt(ratingC)} °C material rating without a written justification: write why it is safe (the maker's evidence) beside the limit, for the reviewer to accept.`,
  dataFromMemory: (label: string) =>
    `Some data of ${label} were entered from memory rather than read from a datasheet or standard; check them against the source.`,
  barAcRatio: (ratio: number) => `R_ac/R_dc = ${fmt(ratio, 4)} was entered from the bar maker's data.`,
} as const;

export const MODEL_TEXT = {
  multicoreGeometry: (cores: number, loadedCores: number, t1KmPerW: number, outerDiameterM: number, mediumBasis: string) =>
    `The heat path of this ${cores}-core cable (${loadedCores} loaded) is solved in two dimensions between round cores laid up touching and the sheath (${mediumBasis}): T₁ = ${fmt(t1KmPerW, 4)} K·m/W per loaded core, overall diameter ${fmt(outerDiameterM * 1000)} mm from the layers. Sector-shaped conductors (common in low-voltage cables from about 35 mm²) and the maker's own dimensions differ; compare the diameter with the datasheet.`,
  sheathLosses: () =>
    'The cable has a metallic screen or armour; currents induced in it (IEC 60287-1-1 loss factors λ₁, λ₂) are not included, which is optimistic for single-core cables bonded at both ends.',
  cableParallelSharing: (parallel: number) =>
    `The current is assumed to divide equally between the ${parallel} parallel cables of each phase; this needs equal lengths and a symmetrical layout.`,
  barParallelSharing: (parallel: number) =>
    `The current is assumed to divide equally between the ${parallel} parallel runs of each phase; this needs equal impedances.`,
  mutualHeating: (circuits: number) =>
    `${circuits} other circuit${circuits > 1 ? 's' : ''} or run${circuits > 1 ? 's' : ''} in air lie${circuits > 1 ? '' : 's'} closer than two cable diameters to this one; IEC 60287-2-1 Table 2 covers one group only, so ${circuits > 1 ? 'their' : 'its'} heating is not computed here.`,
  otherCircuitsNotCovered: (circuits: number) =>
    `${circuits} other circuit${circuits > 1 ? 's' : ''} or run${circuits > 1 ? 's' : ''} in air heat${circuits > 1 ? '' : 's'} this one and no method here covers it: enter a grouping factor for the other circuits (for example from the IEC 60364-5-52 Annex B tables for the installation method) or space them at least two diameters apart.`,
  groupRated: (method: string) => `${method}.`,
  groupRowConservative: (reason: string) => `${reason}.`,
  windNotCreditedToGroup: (speed: number) =>
    `An air speed of ${fmt(speed)} m/s was entered, but the free-air law of a group of cables is for still air, so the wind is not credited (cautious).`,
  screenLossesIncluded: (basis: string) =>
    `Losses in the metallic screen are included: λ₁ ${basis} (IEC 60287-1-1 §2.3, from memory), recomputed at every solve from the conductor's resistance and the screen's temperature and released at the screen.`,
  dielectricLossesIncluded: (lossWPerM: number, reason: string) =>
    `Dielectric losses of ${fmt(lossWPerM, 3)} W/m are included, spread over the insulation: ${reason}.`,
  otherCircuitHeatEntered: (count: number) =>
    `The heat of ${count} other circuit${count > 1 ? 's' : ''} was entered per cable rather than computed here; check it against that circuit's own rating at its current.`,
  barEdges: (factor: number) =>
    `The heat leaving the bar's narrow edges is lumped onto its wide faces by scaling their area by (w + t)/w = ${fmt(factor, 4)}.`,
  multiBarInnerFaces: (barsPerPhase: number) =>
    `Each of the ${barsPerPhase} bars per phase is modelled with both faces free, and the current is assumed to divide equally; inner faces of a pack lose less heat and AC current crowds into the outer bars, so the real pack runs hotter.`,
  barAcFactorComputed: (ratio: number, system: boolean) =>
    `R_ac/R_dc = ${fmt(ratio, 4)} from the current distribution over the bar's cross-section (filament method: skin effect and crowding at the edges${system ? ', and the other phases at the entered spacing, the worst phase taken' : ', the bar alone'}).`,
  phaseSpacingAssumed: (spacingM: number) =>
    `No phase spacing was entered: the phases are taken ${fmt(spacingM * 1000, 3)} mm apart, centre to centre (a clearance of one bar width), for the current sharing and the forces; enter the real spacing.`,
  filamentMeshCoarsened: (across: number, along: number) =>
    `This bar system is wide, thin or large for the filament method: its mesh was limited to ${across} × ${along} filaments per bar, which sees less of the crowding at the edges, so R_ac/R_dc and the outer bars' shares may be understated by a few per cent; check against the bar maker's data.`,
  isolatedBarAssumed: () =>
    "No phase spacing was entered: the bar's AC resistance is that of a bar alone — the other phases' proximity, which raises it, is left out; enter the phase spacing.",
  packRated: (bars: number, hottest: string) =>
    `The ${bars} bars of each phase are rated as a pack: each bar's share of the phase current from the filament method, each bar's heat balance with its gaps as channels (Bar-Cohen & Rohsenow) and radiation between the faces (view factors); ${hottest} governs.`,
  barShortCircuitLimitDefaulted: (limitC: number) =>
    `No short-circuit temperature was given for the bar and its supports: ${fmt(limitC, 3)} °C is assumed (a common limit for bare copper or aluminium bars, from memory); check the supports' and joints' rating.`,
  forcesNotChecked: () =>
    'A fault is entered but the supports are not described (support span and how the bars are held): the short-circuit forces of IEC 60865-1 were not checked.',
  barAcLowerBound: (ratio: number) =>
    `R_ac/R_dc = ${fmt(ratio, 4)} comes from the plane-conductor skin-effect formula, which ignores current crowding at the bar edges and the proximity of other bars and phases, so the true ratio is higher; enter the bar maker's ratio or accept this lower bound.`,
  acFormulaRange: (xs: number, xp: number | null) =>
    `x_s = ${fmt(xs)}${xp === null ? '' : `, x_p = ${fmt(xp)}`}: beyond 2.8 the IEC 60287-1-1 skin-effect expression switches to its large-conductor forms and the proximity expression is outside its stated range; for such large conductors use the maker's AC resistance.`,
  correlationRange: (correlation: string, group: string, side: string, where: string) =>
    `The ${correlation} correlation was used outside its stated range (${group}) at the ${side} surface ${where}; the surface heat transfer there is an extrapolation.`,
  crossCheck: (solverA: number, closedFormA: number, differencePercent: number, limitPercent: number) =>
    `The solver's ampacity (${fmt(solverA, 4)} A) differs from the IEC 60287-style closed form (${fmt(closedFormA, 4)} A) by ${fmt(differencePercent, 2)} %, more than ${limitPercent} %; the closed form takes the conductor as isothermal and its coverings as ideal cylinders, so a large difference means the heat path deserves a second look.`,
} as const;

export const RESULT_TEXT = {
  overLimit: (currentA: number, what: string, limitC: number, temperatureC: number) =>
    `At ${fmt(currentA, 4)} A the ${what} limit of ${fmt(limitC, 4)} °C is exceeded: ${fmt(temperatureC, 4)} °C.`,
  marginUnder10: (marginK: number, marginPercent: number, allowedK: number) =>
    `The margin is ${fmt(marginK, 3)} K, ${fmt(marginPercent, 2)} % of the allowed rise of ${fmt(allowedK, 3)} K — under 10 %, so errors in the inputs could take it over the limit.`,
  nearRunaway: (ratio: number) =>
    `The design current is ${fmt(100 * ratio, 3)} % of the current at which no steady state exists; the rise of resistance with temperature has at least doubled the heating, so small changes in the inputs move the temperature a lot.`,
  runaway: (currentA: number, onsetA: number | undefined) =>
    `At ${fmt(currentA, 4)} A there is no steady state: the conductor heats without bound${onsetA !== undefined ? ` (onset near ${fmt(onsetA, 4)} A)` : ''}.`,
  soilDrying: (surfaceC: number, thresholdC: number) =>
    `The cable surface reaches ${fmt(surfaceC, 3)} °C; above about ${thresholdC} °C moist soil can dry out and its thermal resistivity rise (IEC 60287 two-zone practice, from memory), which is not modelled.`,
  voltageDropExceeded: (percent: number, allowedPercent: number) =>
    `The voltage drop is ${fmt(percent, 3)} % of U₀, above the allowed ${fmt(allowedPercent, 3)} %.`,
} as const;

export const SHORT_CIRCUIT_TEXT = {
  notChecked: () => 'No prospective fault current and clearing time were entered, so the short-circuit withstand was not checked.',
  noLimit: (kind: 'cable' | 'bar') =>
    `No short-circuit temperature limit is known for ${kind === 'cable' ? 'the insulation' : 'the bar, its coating or supports'}, so the fault withstand was not checked.`,
  longDuration: (durationS: number, maxS: number) =>
    `The fault lasts ${fmt(durationS)} s, beyond the ${maxS} s range of the adiabatic method; the computed final temperature over-estimates the real one (cautious).`,
  exceeded: (a: { currentA: number; durationS: number; initialC: number; finalC: number | null; limitC: number; minimumSectionMm2?: number }) =>
    `A fault of ${fmt(a.currentA, 4)} A for ${fmt(a.durationS, 3)} s heats the conductor from ${fmt(a.initialC, 4)} °C to ${a.finalC === null ? 'beyond any meaningful temperature' : `${fmt(a.finalC, 4)} °C`}, above the ${fmt(a.limitC, 4)} °C short-circuit limit${a.minimumSectionMm2 !== undefined ? `; at least ${fmt(a.minimumSectionMm2, 4)} mm² per phase is needed` : `; the limit leaves no room for fault heating above ${fmt(a.initialC, 4)} °C, so no section suffices`}.`,
} as const;

export const GROUP_TEXT = {
  air: (rowText: string, notes: string[]) =>
    `The cables are rated as a group in free air by the IEC 60287-2-1 §4.2.1 surface law for ${rowText}, which stands for convection and radiation together.${notes.length ? ` ${notes.join('; ')}.` : ''}`,
  buried: (cables: number, notes: string[]) =>
    `The ${cables} cables in the ground heat one another: each is rated with the others' heat by superposition with images (IEC 60287-2-1 §4.2.3), every cable's heat at its own temperature, the hottest cable governing.${notes.length ? ` ${notes.join('; ')}.` : ''}`,
} as const;

export const PROTECTION_TEXT = {
  noAmpacity: () => 'The circuit may carry no current at all, so no protective device can be coordinated with it (IEC 60364-4-43 §433.1).',
  notCoordinated: (text: string, left: number, right: number, smallestA: number | undefined) =>
    `Overload protection does not coordinate (IEC 60364-4-43 §433.1): ${text} fails, ${fmt(left, 4)} A against ${fmt(right, 4)} A.${smallestA !== undefined ? ` The smallest device of the series that coordinates is ${fmt(smallestA, 4)} A.` : ' No device of the series coordinates with this conductor: a larger conductor is needed.'}`,
  tooSlow: (faultA: number, requiredS: number, operatingS: number | undefined) =>
    `Automatic disconnection fails (IEC 60364-4-41 §411): the earth-fault current of ${fmt(faultA, 4)} A ${operatingS === undefined ? 'does not operate the device by its data' : `operates the device in ${fmt(operatingS, 3)} s`}, where ${fmt(requiredS, 3)} s is required.`,
  assumptions: (items: string[]) => `The disconnection check rests on: ${items.join('; ')}.`,
  peTooSmall: (installedMm2: number, requiredMm2: number, governing: string) =>
    `The protective conductor of ${fmt(installedMm2, 3)} mm² is below the ${fmt(requiredMm2, 3)} mm² required (IEC 60364-5-54 §543.1, the ${governing} rule governing).`,
  harmonicsNotCovered: (percent: number) =>
    `A third-harmonic content of ${fmt(percent, 3)} % was entered; IEC 60364-5-52 Annex E gives the neutral's derating for four- and five-core cables only, so for this circuit the neutral conductor's heating is not checked here.`,
  neutralGoverns: (neutralA: number, sizingA: number) =>
    `The third harmonics add up in the neutral: ${fmt(neutralA, 4)} A, more than the phase current, so the neutral governs the sizing (${fmt(sizingA, 4)} A with the Annex E factor).`,
  harmonicsOverRating: (sizingA: number, ratingA: number, basis: string) =>
    `With the third harmonics the cable must carry ${fmt(sizingA, 4)} A (${basis}), above its rating of ${fmt(ratingA, 4)} A with three loaded cores, which the Annex E factors apply to.`,
  neutralHeat: (share: number, ratingA: number, ratingThreeA: number) =>
    `The neutral's loss is in the heat balance: ${fmt(share, 3)} × a phase core's (I_N = 3·h₃·I_B), which lowers the rating from ${fmt(ratingThreeA, 4)} A with three loaded cores to ${fmt(ratingA, 4)} A. The Annex E check beside it uses the three-loaded-core rating.`,
  disconnectionNotChecked: () =>
    'The source impedance or the protective conductor was not given, so automatic disconnection (IEC 60364-4-41 §411) and the protective conductor (IEC 60364-5-54 §543.1) were not checked.',
} as const;
