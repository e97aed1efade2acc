/**
 * `lib/electrical/iec60287` — the formulas of IEC 60287 for groups of cables, as a pure library:
 * free-air groups (IEC 60287-2-1 §4.2.1), buried groups by superposition and the closed forms,
 * ducts and backfill (§4.2.2–4.2.7), screen and dielectric losses (IEC 60287-1-1 §2.2–2.3), the
 * rating equation (IEC 60287-1-1 eq. (1)) and the cross-section arrangement as data.
 * Formulas and tables are from memory unless said otherwise (see each doc comment).
 */
export * from './constants';
export * from './arrangement';
export * from './arrangementSchema';
export * from './freeAir';
export * from './buried';
export * from './screens';
export * from './rating';
