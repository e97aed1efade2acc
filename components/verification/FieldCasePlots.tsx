'use client';
/**
 * For a field case: the finite-volume profile beside the closed form, and the grid-convergence
 * study on log-log axes with its measured order and a second-order guide line.
 */
import { Plot, PLOT_CONFIG, PLOT_LAYOUT_BASE } from '@/components/plots/Plot';
import { VIRIDIS_STOPS } from '@/components/plots/ramp';
import { formatNumber, type CaseResult } from '@/lib/verification';

export function FieldCasePlots({ result }: { result: CaseResult }) {
  const profile = result.profile;
  const study = result.convergence;
  if (!profile || !study) return null;
  const finest = study.cells[study.cells.length - 1];
  const finestError = study.maxErrors[study.maxErrors.length - 1];
  // Guide of slope 2 through the finest point: error ∝ (1/cells)².
  const guide = study.cells.map((n) => finestError * (finest / n) ** 2);
  const xScaleMm = 1000;
  // Each plot is a named figure rather than role="img": an image may not hold controls, and Plotly's mode-bar buttons are focusable.
  return (
    <figure className="panel p-3" data-testid={`field-plots-${result.id}`} aria-labelledby={`field-caption-${result.id}`}>
      <figcaption id={`field-caption-${result.id}`} className="text-body font-semibold text-ink-900">
        {result.title}
      </figcaption>
      <p className="mt-0.5 text-caption text-ink-500">{result.source.citation}</p>
      <div className="mt-2 grid gap-3 lg:grid-cols-2">
        <figure aria-label={`Temperature profile of ${result.title}: ${profile.cells} finite-volume cells against the closed form`}>
          <Plot
            data={[
              {
                x: profile.curve.positions.map((x) => x * xScaleMm),
                y: profile.curve.temperatures,
                type: 'scatter',
                mode: 'lines',
                name: 'closed form',
                line: { color: VIRIDIS_STOPS[1], width: 2 },
              },
              {
                x: profile.positions.map((x) => x * xScaleMm),
                y: profile.solver,
                type: 'scatter',
                mode: 'markers',
                name: `finite volume, ${profile.cells} cells`,
                marker: { color: VIRIDIS_STOPS[5], size: 5, symbol: 'circle-open' },
              },
            ]}
            layout={{
              ...PLOT_LAYOUT_BASE,
              height: 280,
              title: { text: 'Profile: finite volume vs closed form', font: { size: 12 } },
              xaxis: { ...PLOT_LAYOUT_BASE.xaxis, title: { text: profile.positionLabel.replace('(m)', '(mm)') } },
              yaxis: { ...PLOT_LAYOUT_BASE.yaxis, title: { text: 'temperature (°C)' } },
              legend: { orientation: 'h', y: -0.3 },
            }}
            config={PLOT_CONFIG}
            useResizeHandler
            style={{ width: '100%' }}
          />
        </figure>
        <figure aria-label={`Grid convergence of ${result.title}: measured order ${study.measuredOrder.toFixed(2)}`}>
          <Plot
            data={[
              {
                x: study.cells,
                y: study.maxErrors,
                type: 'scatter',
                mode: 'lines+markers',
                name: 'largest nodal error',
                line: { color: VIRIDIS_STOPS[2], width: 2 },
                marker: { size: 7 },
              },
              {
                x: study.cells,
                y: guide,
                type: 'scatter',
                mode: 'lines',
                name: 'second order (slope −2)',
                line: { color: '#97a6b7', width: 1, dash: 'dash' },
              },
            ]}
            layout={{
              ...PLOT_LAYOUT_BASE,
              height: 280,
              title: { text: `Grid convergence: measured order ${study.measuredOrder.toFixed(3)}`, font: { size: 12 } },
              xaxis: { ...PLOT_LAYOUT_BASE.xaxis, type: 'log', title: { text: 'cells' } },
              yaxis: { ...PLOT_LAYOUT_BASE.yaxis, type: 'log', title: { text: 'largest |T_FV − T_exact| (K)' }, exponentformat: 'power' },
              legend: { orientation: 'h', y: -0.3 },
            }}
            config={PLOT_CONFIG}
            useResizeHandler
            style={{ width: '100%' }}
          />
        </figure>
      </div>
      <table className="mt-2 text-caption">
        <caption className="sr-only">Largest nodal error for each mesh</caption>
        <thead>
          <tr className="text-ink-500">
            <th scope="row" className="pr-3 text-left font-medium">cells</th>
            {study.cells.map((n) => (
              <th key={n} scope="col" className="num px-2 text-right font-medium">{n}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          <tr>
            <th scope="row" className="pr-3 text-left font-medium text-ink-500">error (K)</th>
            {study.maxErrors.map((e, i) => (
              <td key={study.cells[i]} className="num px-2 text-right">{formatNumber(e, 3)}</td>
            ))}
          </tr>
        </tbody>
      </table>
    </figure>
  );
}
