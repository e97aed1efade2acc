'use client';
/**
 * Adds candidates from the team's catalogue: cable builds and rectangular bars, searched by
 * material, section and build, with n cables or bars per phase. The catalogue rows are turned
 * into sizing candidates in the browser by lib/catalogue's mapping (the same one the server
 * uses), and a full copy is stored on the sheet so that it recomputes the same later.
 */
import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import Decimal from 'decimal.js';
import { barToCandidate, buildLayers, cableBuildToCandidate, type StoredRow } from '@/lib/catalogue';
import { sheetCandidateSchema, type SheetCandidate } from '@/lib/sheet/candidates';
import { convertToSi, formatQuantity, nameInSystem, unitLabel, type UnitSystem } from '@/lib/units';
import { parseNumber } from '@/lib/units/parse';
import { useDecimalSeparator } from '@/components/providers/NumberFormatProvider';
import { INPUT_BOUNDS } from '@/lib/inputBounds';

interface Option {
  key: string;
  kind: 'cable' | 'bar';
  label: string;
  material: 'copper' | 'aluminium';
  sectionMm2: number;
  detail: string;
  make: (perPhase: number, terminalLimitC: number | null) => SheetCandidate;
}

async function fetchKind<K extends 'materials' | 'conductors' | 'coverings' | 'builds'>(kind: K): Promise<StoredRow<K>[]> {
  const response = await fetch(`/api/catalogue/${kind}`);
  if (!response.ok) throw Object.assign(new Error(`The catalogue (${kind}) could not be read (${response.status}).`), { status: response.status });
  return ((await response.json()) as { rows: StoredRow<K>[] }).rows;
}

function useCatalogueOptions(): { options: Option[]; isLoading: boolean; error: Error | null } {
  const materials = useQuery({ queryKey: ['catalogue', 'materials'], queryFn: () => fetchKind('materials') });
  const conductors = useQuery({ queryKey: ['catalogue', 'conductors'], queryFn: () => fetchKind('conductors') });
  const coverings = useQuery({ queryKey: ['catalogue', 'coverings'], queryFn: () => fetchKind('coverings') });
  const builds = useQuery({ queryKey: ['catalogue', 'builds'], queryFn: () => fetchKind('builds') });
  const options = useMemo(() => {
    if (!materials.data || !conductors.data || !coverings.data || !builds.data) return [];
    const materialByKey = new Map(materials.data.map((m) => [m.key, m]));
    const conductorByKey = new Map(conductors.data.map((c) => [c.key, c]));
    const coveringByKey = new Map(coverings.data.map((c) => [c.key, c]));
    const list: Option[] = [];
    for (const build of builds.data) {
      const conductor = conductorByKey.get(build.conductorKey);
      const material = conductor ? materialByKey.get(conductor.materialKey) : undefined;
      if (!conductor || !material || conductor.shape !== 'round') continue;
      const layers = buildLayers(build).flatMap((l) => {
        const covering = coveringByKey.get(l.coveringKey);
        return covering ? [{ covering, thicknessMm: l.thicknessMm, source: l.source }] : [];
      });
      list.push({
        key: `build:${build.id}`,
        kind: 'cable',
        label: build.name,
        material: material.baseMetal,
        sectionMm2: new Decimal(conductor.sectionMm2).toNumber(),
        detail: `${build.cores}-core · ${layers.map((l) => l.covering.name).join(', ')}${build.maker ? ` · ${build.maker}` : ''}`,
        make: (perPhase) => {
          const c = cableBuildToCandidate({ build, conductor, material, layers }, { parallel: perPhase, id: `${build.key}-x${perPhase}` });
          return sheetCandidateSchema.parse({ ...c, label: perPhase > 1 ? `${perPhase} × ${c.label}` : c.label });
        },
      });
    }
    for (const conductor of conductors.data) {
      const material = materialByKey.get(conductor.materialKey);
      if (!material || conductor.shape !== 'rectangular') continue;
      list.push({
        key: `bar:${conductor.id}`,
        kind: 'bar',
        label: `${conductor.designation} ${material.name} bar`,
        material: material.baseMetal,
        sectionMm2: new Decimal(conductor.sectionMm2).toNumber(),
        detail: `${conductor.widthMm} × ${conductor.thicknessMm} mm · ${conductor.r20OhmPerKm} Ω/km at 20 °C`,
        make: (perPhase, terminalLimitC) => {
          const c = barToCandidate({ conductor, material }, { barsPerPhase: perPhase, id: `${conductor.key}-x${perPhase}`, ...(terminalLimitC !== null ? { terminalLimitC } : {}) });
          return sheetCandidateSchema.parse({ ...c, label: `${perPhase} × ${c.label}` });
        },
      });
    }
    return list.sort((a, b) => a.kind.localeCompare(b.kind) || a.material.localeCompare(b.material) || a.sectionMm2 - b.sectionMm2);
  }, [materials.data, conductors.data, coverings.data, builds.data]);
  const error = (materials.error ?? conductors.error ?? coverings.error ?? builds.error) as Error | null;
  return { options, isLoading: materials.isLoading || conductors.isLoading || coverings.isLoading || builds.isLoading, error };
}

export function CandidatePicker({
  preferredKind,
  existingIds,
  units,
  onAdd,
  onClose,
}: {
  preferredKind: 'cable' | 'bar';
  existingIds: string[];
  units: UnitSystem;
  onAdd: (candidate: SheetCandidate) => void;
  onClose: () => void;
}) {
  const { options, isLoading, error } = useCatalogueOptions();
  const [kind, setKind] = useState<'cable' | 'bar'>(preferredKind);
  const [material, setMaterial] = useState<'any' | 'copper' | 'aluminium'>('any');
  const [text, setText] = useState('');
  const [minSection, setMinSection] = useState('');
  const [perPhase, setPerPhase] = useState(1);
  const separator = useDecimalSeparator();
  // 105 °C = 221 °F: the default shown in the user's system.
  const [terminalLimit, setTerminalLimit] = useState(units === 'si' ? '105' : '221');
  const [problem, setProblem] = useState<string | null>(null);

  const words = text.trim().toLowerCase().split(/\s+/).filter(Boolean);
  const areaUnit = unitLabel('areaMm2', units);
  const temperatureUnit = unitLabel('temperature', units);
  // The one parser (lib/units/parse); the section is typed in the user's unit (mm² or kcmil).
  const minParsed = parseNumber(minSection, { decimalSeparator: separator, field: 'Section from' });
  const minProblem = !minParsed.ok && !minParsed.empty ? minParsed.message : null;
  const min = minParsed.ok ? convertToSi(minParsed.value, 'areaMm2', units) : 0;
  const shown = options.filter(
    (o) =>
      o.kind === kind &&
      (material === 'any' || o.material === material) &&
      o.sectionMm2 >= min &&
      words.every((w) => `${o.label} ${o.detail} ${o.sectionMm2}`.toLowerCase().includes(w)),
  );

  return (
    <section aria-labelledby="picker-heading" className="panel border-copper-300 p-3" data-testid="candidate-picker">
      <div className="flex items-baseline justify-between">
        <h3 id="picker-heading" className="font-semibold">Add candidates from the catalogue</h3>
        <button type="button" className="btn-quiet py-0.5 text-caption" onClick={onClose}>Done</button>
      </div>
      <div className="mt-2 grid grid-cols-2 gap-2 md:grid-cols-6">
        <div>
          <label htmlFor="pick-kind" className="field-label">Kind</label>
          <select id="pick-kind" className="field-input py-1" value={kind} onChange={(e) => setKind(e.target.value as 'cable' | 'bar')}>
            <option value="cable">Cables</option>
            <option value="bar">Bars</option>
          </select>
        </div>
        <div>
          <label htmlFor="pick-material" className="field-label">Material</label>
          <select id="pick-material" className="field-input py-1" value={material} onChange={(e) => setMaterial(e.target.value as typeof material)}>
            <option value="any">Any</option>
            <option value="copper">Copper</option>
            <option value="aluminium">Aluminium</option>
          </select>
        </div>
        <div className="col-span-2">
          <label htmlFor="pick-text" className="field-label">Search (build, section, covering)</label>
          <input id="pick-text" data-testid="picker-search" className="field-input py-1" value={text} onChange={(e) => setText(e.target.value)} placeholder="e.g. XLPE 240" />
        </div>
        <div>
          <label htmlFor="pick-min" className="field-label">Section from ({areaUnit})</label>
          <input id="pick-min" data-testid="picker-min-section" className="field-input num py-1" inputMode="decimal" value={minSection} aria-invalid={minProblem ? true : undefined} aria-describedby="pick-min-error" onChange={(e) => setMinSection(e.target.value)} />
          <p id="pick-min-error" className="field-error" aria-live="polite">{minProblem ?? ''}</p>
        </div>
        <div>
          <label htmlFor="pick-n" className="field-label">{kind === 'bar' ? 'Bars per phase' : 'Cables per phase'}</label>
          <input id="pick-n" data-testid="picker-per-phase" type="number" min={1} max={kind === 'bar' ? INPUT_BOUNDS.barsPerPhase.max : INPUT_BOUNDS.parallel.max} className="field-input num py-1" value={perPhase} onChange={(e) => setPerPhase(Math.max(1, Math.round(Number(e.target.value) || 1)))} />
        </div>
      </div>
      {kind === 'bar' ? (
        <div className="mt-2 max-w-md">
          <label htmlFor="pick-terminal" className="field-label">Joint and terminal limit ({temperatureUnit})</label>
          <input id="pick-terminal" className="field-input num py-1" inputMode="decimal" value={terminalLimit} onChange={(e) => setTerminalLimit(e.target.value)} />
          <p className="text-[0.6875rem] leading-4 text-ink-500">The temperature the joints and terminals touching the bar may reach; {units === 'si' ? '105 °C' : '221 °F (105 °C)'} is often used for bare bolted copper joints (common practice). Use the switchgear maker’s value.</p>
        </div>
      ) : null}
      {problem ? <p role="alert" className="field-error">{problem}</p> : null}
      <div className="mt-2 max-h-64 overflow-y-auto rounded border border-ink-100">
        {isLoading ? (
          <p className="p-3 text-caption text-ink-500" role="status">Reading the catalogue…</p>
        ) : error ? (
          <p className="p-3 text-caption text-over" role="alert">{error.message}</p>
        ) : shown.length === 0 ? (
          <p className="p-3 text-caption text-ink-600">
            {options.length === 0 ? 'The team’s catalogue is empty: an admin adds conductors, coverings and cable builds on the Catalogue page (or copies the standard catalogue).' : 'Nothing in the catalogue matches; widen the search.'}
          </p>
        ) : (
          <ul className="divide-y divide-ink-50">
            {shown.slice(0, 80).map((option) => {
              return (
                <li key={option.key} className="flex items-center gap-3 px-2 py-1 text-body">
                  <div className="min-w-0 flex-1">
                    <p className="truncate font-medium">{nameInSystem(option.label, units)}</p>
                    <p className="truncate text-caption text-ink-500">
                      <span className="num">{formatQuantity(option.sectionMm2, 'areaMm2', units)}</span> · {option.material} · {option.detail}
                    </p>
                  </div>
                  <button
                    type="button"
                    className="btn-quiet shrink-0 py-0.5 text-caption"
                    data-testid="picker-add"
                    aria-label={`Add ${perPhase} × ${option.label}`}
                    onClick={() => {
                      try {
                        const parsed = parseNumber(terminalLimit, { decimalSeparator: separator, field: 'Joint and terminal limit' });
                        if (!parsed.ok && !parsed.empty) throw new Error(parsed.message);
                        const limit = parsed.ok ? convertToSi(parsed.value, 'temperature', units) : null;
                        const candidate = option.make(perPhase, limit);
                        if (existingIds.includes(candidate.id)) throw new Error('That candidate (with this many per phase) is already on the sheet.');
                        setProblem(null);
                        onAdd(candidate);
                      } catch (e) {
                        setProblem(e instanceof Error ? e.message : String(e));
                      }
                    }}
                  >
                    Add
                  </button>
                </li>
              );
            })}
          </ul>
        )}
      </div>
    </section>
  );
}
