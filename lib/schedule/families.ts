/**
 * Conductor families: the words a schedule uses to say which conductors a circuit may be sized
 * from ("copper XLPE single-core", "aluminium bars"). A family is derived from catalogue
 * candidates — metal, insulation and number of cores for cables, metal for bars — so the list a
 * team sees is exactly what its catalogue holds.
 */
import type { Candidate } from '../electrical/sizing/types';

export interface ConductorFamily {
  /** Canonical lower-case key used for matching (see normaliseFamilyName). */
  key: string;
  /** How it reads in the UI and the template, e.g. "copper XLPE single-core". */
  label: string;
  kind: 'cable' | 'bar';
  /** Candidates of the family, smallest section first. */
  candidates: Candidate[];
}

/** "aluminum" is accepted for aluminium; case, extra spaces and "single core" vs "single-core" do not matter. */
export function normaliseFamilyName(name: string): string {
  return name
    .toLowerCase()
    .replace(/aluminum/g, 'aluminium')
    .replace(/(\d|single|multi)[\s_]+core/g, '$1-core')
    .replace(/\s+/g, ' ')
    .trim();
}

function coresWord(cores: number): string {
  return cores <= 1 ? 'single-core' : `${cores}-core`;
}

/** The insulation word of a cable: the first word of its insulating layer's name ("XLPE insulation" → "XLPE"). */
function insulationWord(candidate: Extract<Candidate, { kind: 'cable' }>): string {
  const layer = candidate.layers.find((l) => l.role === 'insulation') ?? candidate.layers[0];
  const word = layer?.name.trim().split(/[\s/,(]+/)[0] ?? '';
  return word === '' ? 'insulated' : word;
}

export function familyLabelOf(candidate: Candidate): string {
  if (candidate.kind === 'bar') return `${candidate.material} bars`;
  return `${candidate.material} ${insulationWord(candidate)} ${coresWord(candidate.cores ?? 1)}`;
}

/** Section of one run of the candidate as catalogued (before the schedule multiplies runs), mm². */
export function candidateSectionMm2(candidate: Candidate): number {
  if (candidate.kind === 'cable') return candidate.sectionMm2 * (candidate.parallel ?? 1);
  return candidate.widthM * candidate.thicknessM * 1e6 * (candidate.barsPerPhase ?? 1) * (candidate.parallel ?? 1);
}

/** Groups catalogue candidates into families, each sorted by section (stable on ties). */
export function groupIntoFamilies(candidates: readonly Candidate[]): ConductorFamily[] {
  const families = new Map<string, ConductorFamily>();
  for (const candidate of candidates) {
    const label = familyLabelOf(candidate);
    const key = normaliseFamilyName(label);
    let family = families.get(key);
    if (!family) {
      family = { key, label, kind: candidate.kind, candidates: [] };
      families.set(key, family);
    }
    family.candidates.push(candidate);
  }
  for (const family of families.values()) {
    family.candidates = family.candidates
      .map((c, i) => ({ c, i }))
      .sort((a, b) => candidateSectionMm2(a.c) - candidateSectionMm2(b.c) || a.i - b.i)
      .map(({ c }) => c);
  }
  return [...families.values()].sort((a, b) => a.label.localeCompare(b.label));
}

/** The family a schedule cell names, or undefined. */
export function findFamily<F extends { key: string }>(families: readonly F[], name: string): F | undefined {
  const key = normaliseFamilyName(name);
  return families.find((f) => f.key === key);
}
