'use client';
/** The catalogue screen: a tab per part, search, exports, and the import panel for admins. */
import { useRef, useState, type KeyboardEvent } from 'react';
import { useRouter } from 'next/navigation';
import { CATALOGUE_KINDS, type CatalogueKind } from '@/lib/catalogue/schemas';
import { KIND_LABELS } from '@/lib/catalogue/columns';
import type { UnitSystem } from '@/lib/units';
import { CatalogueTable } from './CatalogueTable';
import { ImportPanel } from './ImportPanel';
import { AddItemPanel } from './AddItemPanel';

export interface CatalogueScreenProps {
  initialKind: CatalogueKind;
  canEdit: boolean;
  units: UnitSystem;
  counts: Record<CatalogueKind, number>;
}

export function CatalogueScreen({ initialKind, canEdit, units, counts }: CatalogueScreenProps) {
  const router = useRouter();
  const [kind, setKind] = useState<CatalogueKind>(initialKind);
  const [search, setSearch] = useState('');
  const [importing, setImporting] = useState(false);
  const [adding, setAdding] = useState(false);
  const [added, setAdded] = useState<string | null>(null);
  const tabRefs = useRef<Record<string, HTMLButtonElement | null>>({});

  function select(next: CatalogueKind, focus = false) {
    setKind(next);
    setSearch('');
    setAdding(false);
    setAdded(null);
    router.replace(`/catalogue?part=${next}`, { scroll: false });
    if (focus) tabRefs.current[next]?.focus();
  }

  function onTabKey(event: KeyboardEvent<HTMLButtonElement>) {
    const index = CATALOGUE_KINDS.indexOf(kind);
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (event.key === 'Home') select(CATALOGUE_KINDS[0], true);
    else if (event.key === 'End') select(CATALOGUE_KINDS[CATALOGUE_KINDS.length - 1], true);
    else if (step) select(CATALOGUE_KINDS[(index + step + CATALOGUE_KINDS.length) % CATALOGUE_KINDS.length], true);
  }

  const label = KIND_LABELS[kind];
  return (
    <div className="grid gap-4">
      <header>
        <h1 id="catalogue-heading" className="text-title">Catalogue</h1>
        <p className="mt-1 max-w-3xl text-ink-600">
          Your team&apos;s conductor metals, cores and bars, insulation and finishes, and cable builds. Sizing sheets take every physical value from here, and
          each value says where it comes from — values marked &ldquo;from memory&rdquo; raise a flag for the reviewer until they are checked against the source.
        </p>
      </header>
      <div role="tablist" aria-label="Parts of the catalogue" className="flex flex-wrap gap-1 border-b border-ink-100">
        {CATALOGUE_KINDS.map((k) => (
          <button
            key={k}
            ref={(el) => {
              tabRefs.current[k] = el;
            }}
            type="button"
            role="tab"
            id={`tab-${k}`}
            aria-selected={k === kind}
            aria-controls="catalogue-panel"
            tabIndex={k === kind ? 0 : -1}
            onClick={() => select(k)}
            onKeyDown={onTabKey}
            className={`-mb-px rounded-t-md border px-3 py-1.5 text-body ${k === kind ? 'border-ink-100 border-b-white bg-white font-semibold text-ink-900' : 'border-transparent text-ink-600 hover:text-ink-900'}`}
          >
            {KIND_LABELS[k].tab} <span className="num text-caption text-ink-500">{counts[k]}</span>
          </button>
        ))}
      </div>
      <div id="catalogue-panel" role="tabpanel" aria-labelledby={`tab-${kind}`} className="grid gap-3">
        <p className="max-w-3xl text-ink-600">{label.blurb}</p>
        <div className="flex flex-wrap items-end gap-3">
          <div className="w-72">
            <label htmlFor="catalogue-search" className="field-label">
              Search {label.tab.toLowerCase()}
            </label>
            <input id="catalogue-search" type="search" className="field-input" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="e.g. 240, XLPE, from memory" />
          </div>
          <div className="flex flex-wrap gap-2">
            <a className="btn-quiet" href={`/api/catalogue/${kind}/export?format=csv`} download>
              Export CSV
            </a>
            <a className="btn-quiet" href={`/api/catalogue/${kind}/export?format=xlsx`} download>
              Export Excel
            </a>
            {canEdit ? (
              <>
                <button
                  type="button"
                  className="btn-primary"
                  aria-expanded={adding}
                  onClick={() => {
                    setAdded(null);
                    setAdding((v) => !v);
                  }}
                >
                  Add a {label.singular}
                </button>
                <button type="button" className="btn-primary" aria-expanded={importing} onClick={() => setImporting((v) => !v)}>
                  Import a file
                </button>
              </>
            ) : null}
          </div>
        </div>
        {added ? (
          <p role="status" className="rounded-md bg-within-light px-3 py-1.5 text-body text-within-dark">
            ✓ Added {added}.
          </p>
        ) : null}
        {canEdit && adding ? (
          <AddItemPanel
            key={kind}
            kind={kind}
            units={units}
            onClose={() => setAdding(false)}
            onAdded={(key) => {
              setAdding(false);
              setAdded(key);
              setSearch(key);
            }}
          />
        ) : null}
        {canEdit && importing ? <ImportPanel key={kind} kind={kind} onClose={() => setImporting(false)} /> : null}
        <CatalogueTable key={`${kind}-${units}`} kind={kind} units={units} canEdit={canEdit} search={search} />
      </div>
    </div>
  );
}
