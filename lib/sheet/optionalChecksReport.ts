/**
 * The optional checks of the chosen candidate (over time, along the run, inside the enclosure) as
 * sentences a reader can follow without the screen: what was checked, the figures, pass or fail,
 * the method, and the flags. One wording for every place a result is shown outside the sheet's
 * own panels — the PDF and the share link — computed from the saved inputs with the same library.
 */
import type { OverTimeResult } from '../electrical/sizing/beyondSteady';
import type { AssumptionFlag } from '../electrical/sizing/flags';
import { formatNumber } from '../units';
import { computeBeyondSteady } from './beyondSteady';
import { computeEnclosureAir } from './enclosureAir';
import type { SheetInputs } from './schema';
import { alongRunPlot, overTimePlots, type PackagePlot } from './packagePlots';

export interface OptionalCheckReport {
  /** Which check: 'Over time', 'Along the run', 'Inside the enclosure'. */
  check: string;
  heading: string;
  /** Result sentences; empty when the check could not be computed. */
  lines: string[];
  /** How it was computed. */
  method: string;
  flags: AssumptionFlag[];
  /** Why the check could not be computed, when it could not. */
  notComputed?: string;
  /** The check's plots for the calculation package (absent in older snapshots). */
  plots?: PackagePlot[];
}

const c = (v: number) => `${formatNumber(v, 4)} °C`;
const SIDES = ['none', 'one', 'both'] as const;

function overTimeLines(inputs: SheetInputs, t: OverTimeResult): string[] {
  const lines: string[] = [];
  if (t.overload) {
    const o = t.overload;
    const when =
      o.timeToLimitS !== null
        ? `the hot spot reaches the ${c(t.limitC)} limit after ${formatNumber(o.timeToLimitS / 60, 3)} min`
        : o.outcome === 'steady-below-limit'
          ? `it never reaches the ${c(t.limitC)} limit`
          : `the limit is not reached within ${formatNumber((2 * o.durationS) / 60, 3)} min`;
    lines.push(`Overload ${formatNumber(o.currentA, 4)} A for ${formatNumber(o.durationS / 60, 3)} min from the steady state at the design current: ${when} — ${o.passes ? 'passes' : 'FAILS'}.`);
  }
  if (t.daily) {
    const d = t.daily;
    lines.push(
      `Daily load (${inputs.overTime.dailyProfileA.length} intervals) repeated ${d.days} days${d.periodic ? ' to a periodic state' : ' (not settled)'}: peak ${c(d.peakC)} at ${formatNumber(d.peakTimeS / 3600, 3)} h — ${d.passes ? 'passes' : 'FAILS'}.`,
    );
  }
  if (t.fault) {
    const f = t.fault;
    lines.push(`Fault with heat flowing into the ${f.heatFlowsInto}: ${c(f.finalC)} at the end, against ${f.iecAdiabaticC === null ? '—' : c(f.iecAdiabaticC)} by the IEC 60949 adiabatic method (which governs the verdict).`);
  }
  return lines;
}

/** The reports of the optional checks switched on, for the chosen candidate; empty when none is on or nothing is chosen. */
export function optionalChecksReport(inputs: SheetInputs): OptionalCheckReport[] {
  const candidateId = inputs.chosenCandidateId;
  if (candidateId === null) return [];
  const reports: OptionalCheckReport[] = [];
  const beyond = inputs.overTime.checked || inputs.alongRun.checked ? computeBeyondSteady(inputs, candidateId) : null;

  if (beyond?.overTime) {
    const t = beyond.overTime;
    reports.push({
      check: 'Over time',
      heading: 'Over time (chosen candidate)',
      lines: t.ok ? overTimeLines(inputs, t.result) : [],
      method: 'Implicit-Euler heat balance on the same finite-volume model as the steady result (Patankar 1980, Numerical Heat Transfer and Fluid Flow).',
      flags: t.ok ? t.result.flags : [],
      ...(t.ok ? { plots: overTimePlots(t.result) } : { notComputed: t.message }),
    });
  }

  if (beyond?.alongRun) {
    const a = beyond.alongRun;
    reports.push({
      check: 'Along the run',
      heading: 'Along the run (chosen candidate)',
      lines: a.ok
        ? [
            `Run of ${formatNumber(inputs.alongRun.lengthM, 4)} m: hot spot ${c(a.result.hotSpot.temperatureC)} at ${formatNumber(a.result.hotSpot.positionM, 3)} m against ${c(a.result.limitC)} — ${a.result.passes ? 'passes' : 'FAILS'}. Heat into the start terminal ${formatNumber(a.result.heatIntoStartW, 3)} W, into the end ${formatNumber(a.result.heatIntoEndW, 3)} W.`,
            ...a.result.joints.map(
              (j, i) => `Joint ${i + 1} at ${formatNumber(j.positionM, 3)} m: ${formatNumber(j.resistanceMicroOhm, 3)} µΩ${j.assumed ? ' (assumed)' : ''}, ${formatNumber(j.heatW, 3)} W, ${c(j.temperatureC)}.`,
            ),
          ]
        : [],
      method: 'Conduction along the bar, sideways loss from the surface correlations at the local temperature, joints as point heat I²R (finite volumes, Patankar 1980).',
      flags: a.ok ? a.result.flags : [],
      ...(a.ok ? { plots: [alongRunPlot(a.result)].filter((p): p is PackagePlot => p !== null) } : { notComputed: a.message }),
    });
  }

  const enclosure = computeEnclosureAir(inputs, candidateId);
  if (enclosure) {
    const e = inputs.enclosureAir;
    const described = `Closed enclosure ${formatNumber(e.heightM, 4)} × ${formatNumber(e.widthM, 4)} × ${formatNumber(e.depthM, 4)} m (H × W × D), ${e.wall.replace('-', ' ')} walls, back ${e.backCovered ? 'against a wall' : 'free'}, sides covered: ${SIDES[e.sidesCovered]}, roof ${e.topCovered ? 'covered' : 'free'}; air around it ${c(e.outsideAirC)}; ${formatNumber(e.routeLengthInsideM, 4)} m of the route inside.`;
    const r = enclosure.ok ? enclosure.result : null;
    reports.push({
      check: 'Inside the enclosure',
      heading: 'Inside the enclosure (chosen candidate)',
      lines: r
        ? [
            described,
            `Losses inside ${formatNumber(r.totalLossesW, 4)} W (circuit ${formatNumber(r.conductorLossesW, 4)} W, other equipment ${formatNumber(r.otherLossesW, 4)} W) over A_e = ${formatNumber(r.effectiveAreaM2, 4)} m²: mean air inside ${c(r.insideAirC)} (sheet ambient ${c(r.sheetAmbientC)}). Hot spot in that air ${r.hotSpotC === null ? 'none (no steady state)' : c(r.hotSpotC)} against ${c(r.limitC)} — ${r.passes ? 'passes' : 'FAILS'}.`,
          ]
        : [described],
      method: r ? `Method: ${r.method}; air and conductor solved together.` : 'Wall heat transfer with the IEC TR 60890 surface factors (common practice, from memory).',
      flags: r ? r.flags : [],
      ...(enclosure.ok ? {} : { notComputed: enclosure.message }),
    });
  }
  return reports;
}
