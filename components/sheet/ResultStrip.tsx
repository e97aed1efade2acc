'use client';
import type { CandidateEvaluation } from '@/lib/electrical/sizing/types';
import { formatNumber, formatQuantity, nameInSystem, type UnitSystem } from '@/lib/units';
import { failureWords, thermalState } from '@/lib/sheet/candidateRow';
import { governingCableOf, governingText } from '@/lib/sheet/groupWords';
import { plainMessage } from '@/lib/sheet/arrangementCheck';
import { RESULT_STATES } from './resultState';

const LIMIT_SOURCES: Record<string, string> = { insulation: 'insulation', coating: 'coating', terminal: 'joints and terminals', user: 'your own limit', layer: 'covering' };

function Figure({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="min-w-0">
      <p className="text-caption tracking-wide text-ink-500">{label}</p>
      <p className="num truncate text-lead font-semibold text-ink-900" data-testid={testId}>{value}</p>
    </div>
  );
}

function WarningList({ warnings }: { warnings: readonly string[] }) {
  if (warnings.length === 0) return null;
  return (
    <ul className="mt-2 space-y-0.5 border-t border-ink-100 pt-1 text-caption text-tight-dark" data-testid="result-warnings" aria-label="Inputs to check">
      {warnings.map((w) => (
        <li key={w}>
          <span aria-hidden="true">▲ </span>
          {w}
        </li>
      ))}
    </ul>
  );
}

/** Hot spot / limit / margin / ampacity of the candidate in focus, with its state as word, icon and colour. */
export function ResultStrip({
  evaluation,
  units,
  source,
  chosen,
  otherLabels = [],
  notCurrent = null,
  warnings = [],
}: {
  /** Accepted inputs that need a word (lib/sheet/inputWarnings): listed with the result they shape. */
  warnings?: readonly string[];
  /**
   * Why the result is not the result of the inputs on the screen (a field it cannot read, inputs
   * out of range), or null. A result that is not current never shows a passing state.
   */
  notCurrent?: string | null;
  evaluation: CandidateEvaluation | null;
  /** Names of the other circuits on the sheet, for the governing cable's words. */
  otherLabels?: readonly string[];
  units: UnitSystem;
  /** Where the numbers come from: the live computation or the stored server snapshot. */
  source: string;
  chosen: boolean;
}) {
  if (!evaluation) {
    return (
      <div className="panel flex items-center gap-3 p-3" data-testid="result-strip">
        <p className="text-ink-600">No result yet: add a candidate conductor to see its hot spot, limit, margin and ampacity.</p>
      </div>
    );
  }
  if (!evaluation.ok) {
    return (
      <div className={`panel border-2 p-3 ${RESULT_STATES.over.box}`} data-testid="result-strip" role="status">
        <p className={`font-semibold ${RESULT_STATES.over.text}`}>✖ {evaluation.label}: could not be evaluated</p>
        <p className="text-body text-ink-800">{evaluation.error.field ? plainMessage(evaluation.error.message, evaluation.error.field) : evaluation.error.message}</p>
      </div>
    );
  }
  if (notCurrent) {
    return (
      <div className="panel border-2 border-dashed border-tight bg-tight-light p-3" data-testid="result-strip" data-state="not-current" role="status" aria-live="polite">
        <p className="font-semibold text-tight-dark" data-testid="result-state">
          <span aria-hidden="true">⚠</span> Not current: {notCurrent}
        </p>
        <p className="text-caption text-ink-700">
          The figures below belong to the last inputs that could be read ({evaluation.label} at <span className="num">{formatNumber(evaluation.designCurrentA, 4)} A</span>), not to what is entered now.
        </p>
        <div className="mt-2 grid grid-cols-2 gap-3 opacity-60 sm:grid-cols-4">
          <Figure label="Hot spot (last readable)" value={evaluation.hotSpotC === null ? '—' : formatQuantity(evaluation.hotSpotC, 'temperature', units, { digits: 4 })} />
          <Figure label="Ampacity (last readable)" value={`${formatNumber(evaluation.ampacityA, 4)} A`} />
        </div>
        <WarningList warnings={warnings} />
      </div>
    );
  }
  const thermal = thermalState(evaluation);
  // A candidate that fails any check (short circuit, voltage drop) is shown as failing, whatever its hot spot.
  const state = evaluation.passes ? thermal.state : 'over';
  const word = evaluation.passes ? thermal.word : failureWords(evaluation);
  const look = RESULT_STATES[state];
  const governing = evaluation.group ? governingCableOf(evaluation.group, otherLabels) : null;
  const t = (c: number | null) => (c === null ? '—' : formatQuantity(c, 'temperature', units, { digits: 4 }));
  const margin =
    evaluation.marginK === null
      ? '—'
      : `${formatQuantity(evaluation.marginK, 'temperatureRise', units, { digits: 3 })}${evaluation.marginPercent !== null ? ` · ${formatNumber(evaluation.marginPercent, 3)} %` : ''}`;
  return (
    <div className={`panel border-2 p-3 ${look.box}`} data-testid="result-strip" data-state={state} role="status" aria-live="polite">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className={`font-semibold ${look.text}`} data-testid="result-state">
          <span aria-hidden="true">{look.icon}</span> {word}
          {!evaluation.passes && thermal.state !== 'over' ? <span className="ml-2 font-normal text-ink-700">(hot spot {thermal.word.toLowerCase()}; see the flags)</span> : null}
        </p>
        <p className="text-caption text-ink-600">
          {chosen ? 'Chosen: ' : 'Viewing: '}
          <span className="font-medium text-ink-800">{nameInSystem(evaluation.label, units)}</span> at <span className="num">{formatNumber(evaluation.designCurrentA, 4)} A</span> · {source}
        </p>
      </div>
      <div className="mt-2 grid grid-cols-2 gap-3 sm:grid-cols-4">
        <Figure label="Hot spot" value={t(evaluation.hotSpotC)} testId="hot-spot" />
        <Figure label={`Limit (${LIMIT_SOURCES[evaluation.limit.source] ?? evaluation.limit.source})`} value={t(evaluation.limit.temperatureC)} testId="limit" />
        <Figure label="Margin" value={margin} testId="margin" />
        <Figure label="Ampacity" value={`${formatNumber(evaluation.ampacityA, 4)} A`} testId="ampacity" />
      </div>
      {governing ? (
        <p className="mt-1 text-caption text-ink-700" data-testid="result-governing">
          {governingText(governing, t)}
        </p>
      ) : null}
      <WarningList warnings={warnings} />
    </div>
  );
}
