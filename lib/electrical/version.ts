/**
 * Names the method and the code that produced a stored result. Bump it whenever lib/thermal or
 * lib/electrical change numbers, so a reviewer can tell a result from an older engine.
 */
/**
 * History: 0.1.0 rated every conductor alone; 0.2.0 rated cable groups (IEC 60287-2-1); 0.3.0
 * rates bar packs as systems (filament R_ac/R_dc and current sharing, the pack's heat transfer),
 * multi-core cables on their two-dimensional heat path, and adds protection and harmonics (the
 * neutral's heat of a four- or five-core cable in its heat balance, Annex E beside it).
 */
export const SOLVER_VERSION =
  'ampwarden-sizing/0.3.0 (lib/thermal finite-volume 1-D; lib/electrical; cable groups by IEC 60287-2-1; bar packs as systems; multi-core heat path in 2-D)';
