/**
 * The one error the thermal library throws for bad input. `field` is the path of the offending
 * value inside the object that was passed, e.g. `geometry.layers[1].conductivity`, so a form can
 * put the message next to the right input.
 */
export class ThermalInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ThermalInputError';
    this.field = field;
  }
}

export function isThermalInputError(error: unknown): error is ThermalInputError {
  return error instanceof ThermalInputError;
}
