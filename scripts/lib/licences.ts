/**
 * Licences of installed packages as their package.json states them (the `license` field, an SPDX
 * expression; or the old `licenses` array), and whether an expression is permissive enough to need
 * no review as a dependency here. SPDX expression syntax: SPDX specification, Annex D ("OR": either
 * licence may be chosen; "AND": both apply).
 */

/** Permissive licences (SPDX ids) that need no review for use as a dependency here (common practice). */
export const PERMISSIVE = new Set(['MIT', 'ISC', 'BSD-2-Clause', 'BSD-3-Clause', 'Apache-2.0', '0BSD', 'BlueOak-1.0.0', 'CC0-1.0', 'Unlicense', 'Zlib', 'Python-2.0', 'CC-BY-4.0', 'MIT-0', 'OFL-1.1']);

export function licenceOf(manifest: Record<string, unknown>): string {
  const { license, licenses } = manifest as { license?: unknown; licenses?: unknown };
  if (typeof license === 'string' && license.trim()) return license.trim();
  if (license && typeof license === 'object' && typeof (license as { type?: unknown }).type === 'string') return (license as { type: string }).type;
  if (Array.isArray(licenses)) {
    const types = licenses.map((l) => (typeof l === 'string' ? l : (l as { type?: string })?.type)).filter(Boolean);
    if (types.length) return types.length > 1 ? `(${types.join(' OR ')})` : String(types[0]);
  }
  return 'UNKNOWN';
}

/**
 * True when the SPDX expression lets this project use the package under permissive terms only: an
 * "OR" needs one permissive side, an "AND" needs both, "AND" binding tighter than "OR" and
 * parentheses grouping (SPDX specification, Annex D). "X WITH exception" counts as X. Anything that
 * is not a well-formed expression of known ids (e.g. "SEE LICENSE IN …", "MIT/X11") is not.
 */
export function isPermissive(expression: string): boolean {
  const tokens = expression.match(/\(|\)|[^\s()]+/g) ?? [];
  let at = 0;
  const peek = () => tokens[at];
  const orExpression = (): boolean | null => {
    let value = andExpression();
    while (value !== null && peek() === 'OR') {
      at += 1;
      const right = andExpression();
      value = right === null ? null : value || right;
    }
    return value;
  };
  const andExpression = (): boolean | null => {
    let value = factor();
    while (value !== null && peek() === 'AND') {
      at += 1;
      const right = factor();
      value = right === null ? null : value && right;
    }
    return value;
  };
  const factor = (): boolean | null => {
    const token = tokens[at++];
    if (token === undefined || token === ')' || token === 'AND' || token === 'OR' || token === 'WITH') return null;
    if (token === '(') {
      const inner = orExpression();
      return tokens[at++] === ')' ? inner : null;
    }
    if (peek() === 'WITH') at += 2;
    return PERMISSIVE.has(token);
  };
  const value = orExpression();
  return value === true && at === tokens.length;
}
