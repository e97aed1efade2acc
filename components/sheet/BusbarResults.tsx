'use client';
/**
 * The bus-bar system of the candidate in focus: the drawing to scale, the table of every bar
 * (the pack), and the forces beside them — so the heat result and the forces read together.
 */
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { busbarDrawingInputOf } from '@/lib/sheet/busbarDrawing';
import type { SheetInputs } from '@/lib/sheet/schema';
import { packBarRows } from '@/lib/sheet/systemWords';
import { formatQuantity, type UnitSystem } from '@/lib/units';
import { BusbarSystemView } from './BusbarSystemView';
import { ForcesPanel } from './ForcesPanel';
import { PackTable } from './PackTable';

export function BusbarResults({ evaluation, inputs, units }: { evaluation: CandidateEvaluationOk; inputs: SheetInputs; units: UnitSystem }) {
  const candidate = inputs.candidates.find((c) => c.id === evaluation.id);
  const drawingInput = candidate ? busbarDrawingInputOf(inputs, candidate, evaluation.pack) : null;
  const titles = evaluation.pack ? packBarRows(evaluation.pack).map((r) => `${r.phase}, ${r.bar}: ${formatQuantity(r.temperatureC, 'temperature', units, { digits: 4 })}, ${(r.shareOfPhase * 100).toFixed(1)} % of the phase current${r.governs ? ' (governs)' : ''}`) : undefined;
  return (
    <div className="grid gap-3 xl:grid-cols-2" data-testid="busbar-results">
      <section aria-labelledby="pack-heading" className="panel p-3">
        <h2 id="pack-heading" className="text-body font-semibold">
          Bus-bar system rated: {evaluation.label}
        </h2>
        {drawingInput ? <BusbarSystemView input={drawingInput} title={`Bus-bar system of ${evaluation.label}`} titles={titles} /> : null}
        {evaluation.pack ? (
          <div className="mt-2">
            <PackTable evaluation={evaluation} units={units} />
          </div>
        ) : (
          <p className="mt-2 text-caption text-ink-600">One bar per phase: rated as one bar, its R_ac/R_dc {evaluation.acFactor.toFixed(4)} by the filament method.</p>
        )}
      </section>
      <ForcesPanel evaluation={evaluation} inputs={inputs} />
    </div>
  );
}
