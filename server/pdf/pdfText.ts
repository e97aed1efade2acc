/**
 * The PDF embeds IBM Plex Sans (latin and Greek subsets, fonts/*.woff), which has no subscript
 * digits, roots, arrows or vulgar sixths. Rather than print empty boxes, those symbols are
 * written out in plain characters the fonts do have (ρ₂₀ → ρ20, x⁴ → x^4, √ → sqrt, ≥ → >=).
 * The screen keeps the original symbols: browsers fall back to another font per glyph.
 */
const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';

const REPLACEMENTS: ReadonlyArray<readonly [RegExp, string | ((match: string) => string)]> = [
  [/[₀-₉]/g, (c) => String(SUBSCRIPT_DIGITS.indexOf(c))],
  [/[⁰⁴⁵⁶⁷⁸⁹]/g, (c) => `^${'⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(c)}`],
  [/⁻/g, '^-'],
  [/∈/g, 'in'],
  [/\^⅙/g, '^(1/6)'],
  [/⅙/g, '1/6'],
  [/\^⅓/g, '^(1/3)'],
  [/⅓/g, '1/3'],
  [/\^⅕/g, '^(1/5)'],
  [/⅕/g, '1/5'],
  [/\^⅘/g, '^(4/5)'],
  [/⅘/g, '4/5'],
  [/√/g, 'sqrt'],
  [/≥/g, '>='],
  [/≤/g, '<='],
  [/≈/g, '~'],
  [/→/g, '->'],
  [/∞/g, 'infinity'],
  [/′/g, "'"],
  [/″/g, "''"],
  [/⚠/g, '!'],
];

export function pdfSafeText(text: string): string {
  let out = text;
  for (const [pattern, replacement] of REPLACEMENTS) {
    out = typeof replacement === 'string' ? out.replace(pattern, replacement) : out.replace(pattern, replacement);
  }
  return out;
}
