/**
 * Finds the first number in a result that is not finite (NaN or ±Infinity), with its path. The API
 * refuses to send such a result: JSON would turn it into null and a client would read "no value"
 * where the computation went wrong.
 */
export function findNonFinite(value: unknown, path = '', seen = new Set<object>()): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path || '(root)';
  if (value === null || typeof value !== 'object') return null;
  if (seen.has(value)) return null;
  seen.add(value);
  if (Array.isArray(value)) {
    for (let index = 0; index < value.length; index += 1) {
      const found = findNonFinite(value[index], path ? `${path}.${index}` : String(index), seen);
      if (found) return found;
    }
    return null;
  }
  for (const [key, item] of Object.entries(value)) {
    const found = findNonFinite(item, path ? `${path}.${key}` : key, seen);
    if (found) return found;
  }
  return null;
}

/** `candidates[0].layers[1].thicknessM` (the library's spelling) → `candidates.0.layers.1.thicknessM` (zod's). */
export function toDotPath(field: string): string {
  return field.replace(/\[(\d+)\]/g, '.$1').replace(/^\./, '');
}
