/**
 * lib/verification — every reference check of the solver and the electrical methods, as data and
 * functions (pure TypeScript: runs in the browser, on the server and in vitest).
 *
 *   import { verificationCases, runCase, casesForMethod } from '@/lib/verification';
 *   const results = verificationCases.map((c) => runCase(c));
 *   casesForMethod('ampacity')  // → [{ id, title, area, href: '/verification#case-…' }]
 */
export { verificationCases, getCase, casesForMethod, verificationCaseHref, METHODS_BEHIND_RESULT, isMethodArea, type CaseLink } from './registry';
export { runCase, withinTolerance, describeTolerance } from './run';
export { productLibrary, type ProductLibrary } from './library';
export { summarise, sourceBasis, reportRows, reportCsv, formatNumber, type ReportSummary, type ReportRow } from './report';
export { METHOD_AREAS, METHOD_AREA_LABELS } from './types';
export type {
  CaseComputation,
  CaseInput,
  CaseResult,
  CaseSource,
  ConvergenceStudy,
  MethodArea,
  ProfileComparison,
  Quantity,
  QuantityResult,
  SourceKind,
  Tolerance,
  VerificationCase,
} from './types';
