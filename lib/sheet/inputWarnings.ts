/**
 * Inputs the sheet accepts but a checking engineer must not pass over without a word (issue 22):
 * each warning names its field and says what the value does to the result. They are shown on the
 * field and above the result; they are not refusals — a DC circuit, a 0 m stub and a purely
 * reactive load are all legitimate, and an own limit at or below the surroundings is what someone
 * may enter to see that nothing can flow — but none of them may pass silently.
 */
import type { SheetInputs } from './schema';
import type { SheetNumericField } from './formUnits';
import { formatQuantity, type UnitSystem } from '../units';

export interface InputWarning {
  field: SheetNumericField;
  message: string;
}

/** The warnings of the inputs, in the order of the form; temperatures in the user's system. */
export function inputWarnings(inputs: SheetInputs, units: UnitSystem = 'si'): InputWarning[] {
  const out: InputWarning[] = [];
  const { circuit } = inputs;
  if (circuit.frequencyHz === 0) {
    out.push({ field: 'circuit.frequencyHz', message: 'Frequency 0 Hz: the circuit is taken as DC — no skin or proximity effect, no reactance in the voltage drop, no induced sheath currents. Enter 50 or 60 Hz for an AC circuit.' });
  }
  if (circuit.powerFactor === 0) {
    out.push({ field: 'circuit.powerFactor', message: 'Power factor 0: a purely reactive load — the voltage drop takes the reactance alone (sin φ = 1) and the resistance not at all. Check that this is meant.' });
  }
  if (circuit.lengthM === 0) {
    out.push({ field: 'circuit.lengthM', message: 'Route length 0 m: the voltage drop, the losses over the route, the conductor mass and the cost are all zero. The temperatures do not depend on it.' });
  }
  const limitC = inputs.limits.temperatureLimitC;
  if (limitC !== null) {
    const buried = inputs.installation.kind === 'buried';
    const surroundingC = buried ? inputs.installation.groundC : inputs.environment.ambientC;
    if (surroundingC !== null && limitC <= surroundingC) {
      const where = buried ? 'ground temperature' : 'ambient';
      out.push({
        field: 'limits.temperatureLimitC',
        message: `Your own limit (${formatQuantity(limitC, 'temperature', units)}) is not above the ${where} (${formatQuantity(surroundingC, 'temperature', units)}): no current at all keeps the conductor under it, so every candidate rates 0 A. Check the limit and the ${where}.`,
      });
    }
  }
  return out;
}
