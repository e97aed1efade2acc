/**
 * The plots a checking engineer looks at in the calculation package (issue 22): hot spot against
 * current, the hot spot over time (overload, daily cycle, fault), the temperature along a bar's
 * run, and the temperature across a bus-bar pack. Plain data (lines of points with axis words and
 * the limit), computed once with the snapshot from the saved inputs and stored in it, so that the
 * PDF draws what the reviewer approved. Pure.
 */
import type { AlongRunResult, OverTimeResult } from '../electrical/sizing/beyondSteady';
import type { CandidateEvaluationOk } from '../electrical/sizing/types';
import type { HotSpotCurve } from './compute';

export interface PlotLine {
  label: string;
  /** [x, y] in the plot's units (A, h, min, m, mm; °C). */
  points: [number, number][];
  /** Drawn dashed (a reference beside the computed line). */
  dashed?: boolean;
}

export interface PackagePlot {
  id: 'hot-spot-vs-current' | 'overload' | 'daily' | 'fault' | 'along-run' | 'across-pack';
  title: string;
  xLabel: string;
  yLabel: string;
  lines: PlotLine[];
  /** The governing temperature limit, °C, drawn as a dashed line. */
  limitC: number | null;
  /** A vertical mark (the design current, a joint), with its words. */
  marks?: { x: number; label: string }[];
}

/** At most this many points per line: a plot a person reads, not a data file (the snapshot stays small). */
export const MAX_PLOT_POINTS = 120;

export function thinPoints(points: [number, number][], max = MAX_PLOT_POINTS): [number, number][] {
  if (points.length <= max) return points;
  const step = (points.length - 1) / (max - 1);
  const out: [number, number][] = [];
  for (let i = 0; i < max; i += 1) out.push(points[Math.round(i * step)]);
  return out;
}

const round = (v: number, digits = 5) => Number(v.toPrecision(digits));

export function hotSpotCurvePlot(curve: HotSpotCurve, evaluation: CandidateEvaluationOk): PackagePlot | null {
  const points = curve.points.filter((p) => p.hotSpotC !== null).map((p) => [round(p.currentA), round(p.hotSpotC as number)] as [number, number]);
  if (points.length < 2) return null;
  return {
    id: 'hot-spot-vs-current',
    title: `Hot spot against current: ${evaluation.label}`,
    xLabel: 'current per phase (A)',
    yLabel: 'hot spot (°C)',
    lines: [{ label: evaluation.label, points }],
    limitC: evaluation.limit.temperatureC,
    marks: [
      { x: evaluation.designCurrentA, label: 'design current' },
      ...(evaluation.ampacityA > 0 ? [{ x: round(evaluation.ampacityA), label: 'ampacity' }] : []),
    ],
  };
}

export function overTimePlots(result: OverTimeResult): PackagePlot[] {
  const plots: PackagePlot[] = [];
  if (result.overload && result.overload.series.length > 1) {
    plots.push({
      id: 'overload',
      title: `Hot spot during the overload of ${round(result.overload.currentA, 4)} A`,
      xLabel: 'time from the start of the overload (min)',
      yLabel: 'hot spot (°C)',
      lines: [{ label: 'hot spot', points: thinPoints(result.overload.series.map((p) => [round(p.timeS / 60), round(p.hotSpotC)])) }],
      limitC: result.limitC,
    });
  }
  if (result.daily && result.daily.series.length > 1) {
    plots.push({
      id: 'daily',
      title: 'Hot spot over the daily load cycle (settled day)',
      xLabel: 'time of day (h)',
      yLabel: 'hot spot (°C)',
      lines: [{ label: 'hot spot', points: thinPoints(result.daily.series.map((p) => [round(p.timeS / 3600), round(p.hotSpotC)])) }],
      limitC: result.limitC,
    });
  }
  if (result.fault && result.fault.series.length > 1) {
    plots.push({
      id: 'fault',
      title: 'Conductor during the fault',
      xLabel: 'time from the start of the fault (s)',
      yLabel: 'conductor (°C)',
      lines: [
        { label: `heat flowing into the ${result.fault.heatFlowsInto}`, points: thinPoints(result.fault.series.map((p) => [round(p.timeS), round(p.hotSpotC)])) },
        { label: 'adiabatic', points: thinPoints(result.fault.series.map((p) => [round(p.timeS), round(p.adiabaticC)])), dashed: true },
      ],
      limitC: result.fault.limitC,
    });
  }
  return plots;
}

export function alongRunPlot(result: AlongRunResult): PackagePlot | null {
  if (result.positionsM.length < 2) return null;
  return {
    id: 'along-run',
    title: 'Temperature along the run between the terminals',
    xLabel: 'position along the run (m)',
    yLabel: 'conductor (°C)',
    lines: [{ label: 'conductor', points: thinPoints(result.positionsM.map((x, i) => [round(x), round(result.temperaturesC[i])])) }],
    limitC: result.limitC,
    marks: result.joints.map((j, i) => ({ x: round(j.positionM), label: `joint ${i + 1}` })),
  };
}

/** Each bar's temperature across the three phases' packs, in the order they stand. */
export function acrossPackPlot(evaluation: CandidateEvaluationOk): PackagePlot | null {
  const pack = evaluation.pack;
  if (!pack || pack.bars.length < 2) return null;
  const phases = [...new Set(pack.bars.map((b) => b.phase))];
  let index = 0;
  const lines: PlotLine[] = phases.map((phase) => ({
    label: `phase ${phase}`,
    points: pack.bars.filter((b) => b.phase === phase).map((b) => {
      index += 1;
      return [index, round(b.temperatureC)] as [number, number];
    }),
  }));
  return {
    id: 'across-pack',
    title: `Temperature of each bar across the packs: ${evaluation.label}`,
    xLabel: 'bar, counted across the phases',
    yLabel: 'bar (°C)',
    lines,
    limitC: evaluation.limit.temperatureC,
  };
}
