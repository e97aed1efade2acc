/**
 * Names the method and the code that produced a stored result. Bump it whenever lib/thermal or
 * lib/electrical change numbers, so a reviewer can tell a result from an older engine.
 */
export const SOLVER_VERSION = 'ampwarden-sizing/0.2.0 (lib/thermal finite-volume 1-D; lib/electrical; cable groups by IEC 60287-2-1)';
