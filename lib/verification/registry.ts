/**
 * The registry of verification cases: the one list that the /verification page runs in the
 * browser, the PDF report runs on the server and vitest runs in CI, so they cannot disagree.
 */
import { ampacityCases } from './cases/ampacity';
import { catalogueCases } from './cases/catalogue';
import { conductionCases } from './cases/conduction';
import { electricalCases } from './cases/electrical';
import { jouleCases } from './cases/joule';
import { linearAlgebraCases } from './cases/linearAlgebra';
import { surfaceCases } from './cases/surfaces';
import { tabulatedCases } from './cases/tabulated';
import { METHOD_AREAS, type MethodArea, type VerificationCase } from './types';

export const verificationCases: readonly VerificationCase[] = Object.freeze([
  ...conductionCases,
  ...surfaceCases,
  ...jouleCases,
  ...electricalCases,
  ...ampacityCases,
  ...catalogueCases,
  ...tabulatedCases,
  ...linearAlgebraCases,
]);

export function getCase(id: string): VerificationCase | undefined {
  return verificationCases.find((c) => c.id === id);
}

/** What the sizing sheet needs to link a result to the checks of its method. */
export interface CaseLink {
  id: string;
  title: string;
  area: MethodArea;
  /** The case's row on the verification page. */
  href: string;
}

export function verificationCaseHref(id: string): string {
  return `/verification#case-${id}`;
}

/**
 * The cases that cover one method area (or several), for links from a result:
 *   casesForMethod('ampacity') → [{ id, title, area, href: '/verification#case-…' }, …]
 *   casesForMethod(['conduction', 'convection'])
 */
export function casesForMethod(area: MethodArea | readonly MethodArea[]): CaseLink[] {
  const wanted = new Set<MethodArea>(typeof area === 'string' ? [area] : area);
  return verificationCases
    .filter((c) => wanted.has(c.area))
    .map((c) => ({ id: c.id, title: c.title, area: c.area, href: verificationCaseHref(c.id) }));
}

/**
 * Which method areas stand behind each figure of a sizing sheet's result (a convenience for the
 * sheet: `casesForMethod(METHODS_BEHIND_RESULT.hotSpot)`).
 */
export const METHODS_BEHIND_RESULT = {
  hotSpot: ['conduction', 'convection', 'radiation', 'joule-runaway', 'iec60287-resistance', 'skin-effect', 'linear-algebra'],
  ampacity: ['ampacity', 'conduction', 'convection', 'radiation', 'joule-runaway', 'iec60287-resistance', 'skin-effect'],
  losses: ['iec60287-resistance', 'skin-effect'],
  voltageDrop: ['voltage-drop'],
  shortCircuit: ['short-circuit'],
  runaway: ['joule-runaway'],
  conductorData: ['catalogue', 'iec60287-resistance'],
} as const satisfies Record<string, readonly MethodArea[]>;

export function isMethodArea(value: unknown): value is MethodArea {
  return typeof value === 'string' && (METHOD_AREAS as readonly string[]).includes(value);
}
