'use client';
/**
 * One cross-section solved in two dimensions (lib/sheet/crossSectionField.ts FieldReport), beside
 * the IEC rating: the governing cable and the ampacity by the field against the rating's, the heat
 * map of the ground with isotherms and the cables drawn (viridis, a perceptually uniform ramp),
 * every cable's temperature with the rating's beside it, how the field was set up, the solver's
 * flags and the caution. The sheet shows a live report; the sheet in review and the share page
 * show the one stored with the snapshot.
 */
import { flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import { memo } from 'react';
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from '@/components/plots/Plot';
import { FIELD_CAUTION, type FieldReport } from '@/lib/sheet/crossSectionField';
import { isothermLevels } from '@/lib/sheet/fieldPicture';
import { cableWords } from '@/lib/sheet/groupWords';
import { convertFromSi, formatNumber, unitLabel, type UnitSystem } from '@/lib/units';

const ROLE_WORDS = { rated: 'being sized', 'same-cable': 'same cable, own current', fixed: 'given by its heat' } as const;

function FieldHeatMap({ report, units }: { report: FieldReport; units: UnitSystem }) {
  const picture = report.picture;
  if (!picture) return <p className="p-4 text-caption text-ink-500">No field to draw: there is no steady state at the design current.</p>;
  const len = (m: number) => convertFromSi(m, 'lengthM', units);
  const temp = (c: number) => convertFromSi(c, 'temperature', units);
  const lUnit = unitLabel('lengthM', units);
  const tUnit = unitLabel('temperature', units);
  const dx = (picture.xMaxM - picture.xMinM) / picture.columns;
  const dy = (picture.depthBottomM - picture.depthTopM) / picture.rows;
  const x = Array.from({ length: picture.columns }, (_, c) => len(picture.xMinM + (c + 0.5) * dx));
  const y = Array.from({ length: picture.rows }, (_, r) => len(picture.depthTopM + (r + 0.5) * dy));
  const z = Array.from({ length: picture.rows }, (_, r) => picture.temperaturesC.slice(r * picture.columns, (r + 1) * picture.columns).map(temp));
  const levels = isothermLevels(temp(picture.minC), temp(picture.maxC), 7);
  const step = levels.length > 1 ? levels[1] - levels[0] : 1;
  const governing = report.governing?.cable;
  const shapes: object[] = [
    { type: 'line', x0: len(picture.xMinM), x1: len(picture.xMaxM), y0: 0, y1: 0, line: { color: '#233040', width: 2 } },
  ];
  if (report.group.bank) {
    const b = report.group.bank;
    shapes.push({ type: 'rect', x0: len(b.centreXM - b.widthM / 2), x1: len(b.centreXM + b.widthM / 2), y0: len(b.centreDepthM - b.heightM / 2), y1: len(b.centreDepthM + b.heightM / 2), line: { color: '#f1ebdf', width: 1, dash: 'dash' } });
  }
  report.group.cables.forEach((c, k) => {
    const circle = (r: number, line: object) => ({ type: 'circle', x0: len(c.xM - r), x1: len(c.xM + r), y0: len(-c.yM - r), y1: len(-c.yM + r), line });
    if (c.envelopeDiameterM > c.externalDiameterM) shapes.push(circle(c.envelopeDiameterM / 2, { color: '#ffffff', width: 1, dash: 'dot' }));
    shapes.push({ ...circle(c.externalDiameterM / 2, { color: k === governing ? '#a8402b' : '#1a2431', width: k === governing ? 2.5 : 1 }), fillcolor: c.role === 'rated' ? 'rgba(61,78,98,0.55)' : 'rgba(151,166,183,0.55)' });
  });
  return (
    // Not hidden from assistive technology (Plotly's mode-bar buttons inside are focusable): the figure
    // around it is named, and the table beside it carries every number for a screen reader.
    <div data-testid="field-heatmap">
      <Plot
        data={[
          {
            type: 'heatmap',
            x,
            y,
            z,
            colorscale: 'Viridis',
            zsmooth: 'best',
            colorbar: { title: { text: tUnit }, thickness: 12 },
            hovertemplate: `across %{x:.3f} ${lUnit}, depth %{y:.3f} ${lUnit}: %{z:.2f} ${tUnit}<extra></extra>`,
          },
          ...(levels.length > 0
            ? [
                {
                  type: 'contour' as const,
                  x,
                  y,
                  z,
                  showscale: false,
                  contours: { coloring: 'none' as const, showlabels: true, start: levels[0], end: levels[levels.length - 1], size: step, labelfont: { color: '#ffffff', size: 9 } },
                  line: { color: 'rgba(255,255,255,0.85)', width: 1 },
                  hoverinfo: 'skip' as const,
                },
              ]
            : []),
        ]}
        layout={{
          ...PLOT_LAYOUT_BASE,
          title: { text: `The ground at ${formatNumber(report.designCurrentA, 4)} A (${tUnit})` },
          height: 380,
          margin: { ...PLOT_LAYOUT_BASE.margin, r: 24 },
          xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: `across (${lUnit})` }, constrain: 'domain' },
          yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: `depth (${lUnit})` }, autorange: 'reversed', scaleanchor: 'x', constrain: 'domain' },
          shapes: shapes as never,
          showlegend: false,
        }}
        config={PLOT_CONFIG}
        style={{ width: '100%' }}
      />
    </div>
  );
}

const MemoHeatMap = memo(FieldHeatMap);

export function FieldReportView({ report, units, otherLabels = [] }: { report: FieldReport; units: UnitSystem; otherLabels?: readonly string[] }) {
  const tUnit = unitLabel('temperature', units);
  const rUnit = unitLabel('temperatureRise', units);
  const t = (c: number | null) => (c === null ? '—' : formatNumber(convertFromSi(c, 'temperature', units), 4));
  const dt = (k: number | null) => (k === null ? '—' : `${k >= 0 ? '+' : '−'}${formatNumber(Math.abs(convertFromSi(k, 'temperatureRise', units)), 3)}`);
  const a = report.ampacity;
  const group = report.group;
  const surface =
    report.surface.kind === 'isothermal'
      ? `ground surface held at ${t(report.surface.temperatureC)} ${tUnit}`
      : `ground surface giving heat to the air at ${formatNumber(report.surface.heatTransferCoefficientWPerM2K!, 3)} W/(m²·K)`;
  return (
    <div className="space-y-2" data-testid="field-report" data-elapsed-ms={Math.round(report.elapsedMs)} data-solves={report.solves} data-cells={report.mesh.cells}>
      {report.reviewFlags.length > 0 ? (
        <ul className="rounded-md border border-tight bg-tight-light px-3 py-1.5 text-body text-tight-dark" data-testid="field-review-flags">
          {report.reviewFlags.map((f) => (
            <li key={f.code} data-flag-code={f.code}>
              <span className="font-medium">{flagTitle(f.code)}</span> (for review): {f.message}
            </li>
          ))}
        </ul>
      ) : null}
      {report.status !== 'converged' ? (
        <p className="field-error" data-testid="field-no-steady-state">
          No steady state in the field at the design current: {report.message}
        </p>
      ) : null}
      <dl className="grid gap-x-4 gap-y-1 text-body sm:grid-cols-2" data-testid="field-summary">
        <div className="flex justify-between gap-2 border-b border-ink-50 py-1">
          <dt>Governing, by the field</dt>
          <dd className="num text-right" data-testid="field-governing">
            {report.governing ? `${report.governing.words}, ${t(report.governing.conductorC)} ${tUnit} of ${t(report.limitC)} ${tUnit}` : '—'}
          </dd>
        </div>
        <div className="flex justify-between gap-2 border-b border-ink-50 py-1">
          <dt>Governing, by the IEC rating</dt>
          <dd className="num text-right" data-testid="field-iec-governing">
            {report.iecGoverning ? `${report.iecGoverning.words}, ${t(report.iecGoverning.conductorC)} ${tUnit}` : '—'}
          </dd>
        </div>
        <div className="flex justify-between gap-2 border-b border-ink-50 py-1">
          <dt>Field − IEC, governing conductor</dt>
          <dd className="num" data-testid="field-governing-difference">
            {dt(report.governingDifferenceK)} {rUnit}
          </dd>
        </div>
        <div className="flex justify-between gap-2 border-b border-ink-50 py-1">
          <dt>Ampacity: field / IEC</dt>
          <dd className="num text-right" data-testid="field-ampacity">
            {a.fieldA === null ? '—' : `${formatNumber(a.fieldA, 4)} A`} / {formatNumber(a.iecA, 4)} A
            {a.differencePercent !== null ? ` (${a.differencePercent >= 0 ? '+' : '−'}${formatNumber(Math.abs(a.differencePercent), 3)} %)` : ''}
          </dd>
        </div>
      </dl>
      {a.message ? <p className="text-caption text-over-dark">The field’s ampacity could not be found: {a.message}</p> : null}
      {a.iecLimitedBy ? <p className="text-caption text-ink-600">The IEC ampacity is governed by {a.iecLimitedBy}; the field’s is against the conductor’s limit.</p> : null}
      <div className="grid gap-3 xl:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]">
        <figure className="panel p-1" aria-label={`Heat map of the ground around ${report.candidateLabel} at ${formatNumber(report.designCurrentA, 4)} A`}>
          <MemoHeatMap report={report} units={units} />
          <figcaption className="px-1 text-caption text-ink-600">
            Heat map of the ground (viridis: dark is cool, yellow is hot) with isotherms; the cables drawn over it{report.governing ? ', the governing one ringed in red' : ''}. Inside a cable’s circle the map shows the soil’s field; the cable’s own temperatures are in the table.
          </figcaption>
        </figure>
        <div className="min-w-0">
          <table className="w-full text-caption" data-testid="field-cables">
            <caption className="mb-1 text-left text-ink-600">Every cable at {formatNumber(report.designCurrentA, 4)} A: the field beside the IEC rating</caption>
            <thead>
              <tr className="text-left text-ink-500">
                <th scope="col" className="pr-2 font-medium">Cable</th>
                <th scope="col" className="pr-2 text-right font-medium">Field ({tUnit})</th>
                <th scope="col" className="pr-2 text-right font-medium">IEC ({tUnit})</th>
                <th scope="col" className="pr-2 text-right font-medium">Field − IEC ({rUnit})</th>
                <th scope="col" className="text-right font-medium">Surface, field ({tUnit})</th>
              </tr>
            </thead>
            <tbody>
              {report.cables.map((c, k) => {
                const governs = report.governing?.cable === k;
                return (
                  <tr key={k} className={`border-t border-ink-100 ${governs ? 'font-semibold text-over-dark' : ''}`} data-testid={`field-cable-${k}`}>
                    <th scope="row" className="py-0.5 pr-2 text-left font-normal">
                      {governs ? <span aria-hidden="true">● </span> : null}
                      {cableWords(group, k, otherLabels)}
                      {governs ? ' (governs)' : ''}
                      <span className="block text-ink-500">{ROLE_WORDS[group.cables[k].role]}</span>
                    </th>
                    <td className="num whitespace-nowrap pr-2 text-right" data-testid={`field-conductor-${k}`}>{t(c.conductorC)}</td>
                    <td className="num whitespace-nowrap pr-2 text-right">{t(c.iecConductorC)}</td>
                    <td className="num whitespace-nowrap pr-2 text-right">{dt(c.differenceK)}</td>
                    <td className="num whitespace-nowrap text-right">{t(c.surfaceC)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="mt-1 text-[0.6875rem] leading-4 text-ink-500" data-testid="field-mesh">
            Solved on {report.mesh.words}: {formatNumber(report.mesh.cells, 6)} cells ({report.mesh.nx} × {report.mesh.ny}), {report.mesh.cellsAcrossCable} across a cable, smallest {formatNumber(report.mesh.smallestCellM * 1000, 3)} mm; domain {formatNumber(report.domain.widthM, 3)} m × {formatNumber(report.domain.depthM, 3)} m; {surface}; {report.solves} solves
            {report.heat ? `; energy balance closes to ${report.heat.energyResidual.toExponential(1)}` : ''}.
          </p>
          <ul className="mt-1 list-disc space-y-0.5 pl-4 text-[0.6875rem] leading-4 text-ink-600" data-testid="field-notes">
            {report.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          {report.flags.length > 0 ? (
            <ul className="mt-1 space-y-1 text-caption" data-testid="field-flags">
              {report.flags.map((f) => (
                <li key={f.code + f.message} data-flag-code={f.code} className={f.severity === 'review' ? 'text-tight-dark' : 'text-ink-600'}>
                  <span className="font-medium">{flagTitle(f.code)}</span> ({SEVERITY_WORDS[f.severity]}): {f.message}
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-caption text-ink-500" data-testid="field-flags">No flags from the field solver.</p>
          )}
        </div>
      </div>
      <aside role="note" aria-label="Caution about the field" className="rounded-md border border-tight/40 bg-tight-light/60 px-3 py-2 text-caption text-ink-900" data-testid="field-caution">
        <span aria-hidden="true" className="font-bold text-tight-dark">⚠ </span>
        {FIELD_CAUTION}
      </aside>
    </div>
  );
}
