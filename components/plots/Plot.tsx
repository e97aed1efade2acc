'use client';
/**
 * Plotly, loaded only in the browser (next/dynamic, ssr: false) from the minified distribution,
 * through react-plotly.js's factory so that the full plotly.js is never bundled.
 */
import dynamic from 'next/dynamic';
import type { PlotParams } from 'react-plotly.js';

export const Plot = dynamic<PlotParams>(
  async () => {
    const [{ default: createPlotlyComponent }, { default: Plotly }] = await Promise.all([
      import('react-plotly.js/factory'),
      import('plotly.js-dist-min'),
    ]);
    return createPlotlyComponent(Plotly);
  },
  { ssr: false, loading: () => <div className="flex h-full min-h-48 items-center justify-center text-caption text-ink-400">Loading the plot…</div> },
);

/** Ampwarden's plot frame: Plex fonts, paper background, quiet grid. */
export const PLOT_LAYOUT_BASE = {
  font: { family: 'IBM Plex Sans, system-ui, sans-serif', size: 11, color: '#233040' },
  paper_bgcolor: '#ffffff',
  plot_bgcolor: '#ffffff',
  margin: { l: 52, r: 12, t: 28, b: 40 },
  xaxis: { gridcolor: '#e1e6ec', zerolinecolor: '#c3ccd7' },
  yaxis: { gridcolor: '#e1e6ec', zerolinecolor: '#c3ccd7' },
} as const;

// No "Share chart" button: a sheet's figures never go to a third-party cloud (and the CSP would block it).
export const PLOT_CONFIG = { displaylogo: false, responsive: true, showSendToCloud: false, modeBarButtonsToRemove: ['lasso2d', 'select2d'] } as PlotParams['config'];
