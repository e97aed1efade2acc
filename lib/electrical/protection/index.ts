/**
 * `lib/electrical/protection` — the rest of a low-voltage circuit check (physics.md §11):
 * protective devices as data, overload coordination (IEC 60364-4-43 §433.1), automatic
 * disconnection (IEC 60364-4-41 §411), protective-conductor section (IEC 60364-5-54 §543.1),
 * third harmonics in four- and five-core cables (IEC 60364-5-52 Annex E); and, from
 * lib/electrical/multicore.ts, the internal thermal resistances of multi-core cables.
 */
export * from './device';
export * from './coordination';
export * from './disconnection';
export * from './protectiveConductor';
export * from './harmonics';
export {
  isothermalCirclesInSheath,
  multicoreCableThermal,
  effectiveInternalLayer,
  concentricCoveringThermalResistance,
} from '../multicore';
export type { IsothermalCircle, ConductionMatrixResult, MulticoreCableInput, MulticoreCableResult } from '../multicore';
