/**
 * The one number parser for what people type or paste: the sheet's fields, the add-candidates
 * dialog, the optional checks, the catalogue grid and the cells of uploaded files.
 *
 * The rule (issue 22, "Input and units"):
 * - The user's decimal separator ('.' or ',') is the only decimal mark accepted, at most once.
 * - The other mark is never read silently. Where it could be a thousands grouping as well as a
 *   decimal mark ("1,250" under '.', "1.250" under ','), the text is ambiguous and is refused with
 *   both readings spelled out ("Design current: 1,250 — use 1250 or 1.25"). Any other use of it
 *   ("1,25" under '.') is refused with the separator to use.
 * - Thousands groupings of any kind (spaces, apostrophes, the other mark) are refused: a person
 *   writes 1250.
 * - Hexadecimal ("0x4E2"), exponent forms ("1e3"), "Infinity", "NaN" and an empty text are refused.
 *   JavaScript's Number() accepts all of these; nobody sizing a cable means them.
 * - Leading and trailing spaces are ignored; a leading '+' or '-' (also the typographic minus
 *   U+2212) is allowed; ".5" and "5." read as 0.5 and 5.
 *
 * Pure TypeScript: runs in the browser and on the server.
 */

export type DecimalSeparator = '.' | ',';

export const DECIMAL_SEPARATORS: readonly DecimalSeparator[] = ['.', ','];

export type ParsedNumber =
  | { ok: true; value: number }
  /** `empty` tells a blank text (an optional field may take it as "not entered") from a wrong one. */
  | { ok: false; empty: boolean; message: string };

export interface ParseNumberOptions {
  decimalSeparator: DecimalSeparator;
  /** The field's name as the person reads it ("Design current"): every message starts with it. */
  field: string;
  /**
   * Accept "1.72e-8": only where a person means it — catalogue properties that are tiny by nature
   * (a resistivity in Ω·m). Never on the sheet, where "1e3" is a slip.
   */
  exponent?: boolean;
}

const OTHER: Record<DecimalSeparator, DecimalSeparator> = { '.': ',', ',': '.' };
const SEPARATOR_WORD: Record<DecimalSeparator, string> = { '.': 'a point', ',': 'a comma' };

function refuse(field: string, message: string, empty = false): ParsedNumber {
  return { ok: false, empty, message: `${field}: ${message}` };
}

/** Parses `text` as a number written with the user's decimal separator; see the rule above. */
export function parseNumber(text: string, { decimalSeparator, field, exponent = false }: ParseNumberOptions): ParsedNumber {
  const trimmed = text.trim().replace(/\u2212/g, '-');
  if (trimmed === '') return refuse(field, 'enter a number', true);
  const shown = text.trim();
  const sign = /^[-+]/.test(trimmed) ? trimmed[0] : '';
  const body = sign ? trimmed.slice(1) : trimmed;
  const other = OTHER[decimalSeparator];

  if (/^0x/i.test(body) || /^0[bo]/i.test(body)) return refuse(field, `${shown} is not a decimal number — write it in decimal digits`);
  if (/^(infinity|inf|nan)$/i.test(body)) return refuse(field, `${shown} is not a number`);
  const exponentForm = /^(\d+[.,]?\d*|[.,]\d+)e[-+]?\d+$/i.exec(body);
  if (exponentForm && exponent) {
    const mantissa = parseNumber(sign + body.slice(0, body.search(/e/i)), { decimalSeparator, field });
    if (!mantissa.ok) return mantissa;
    const value = Number(`${mantissa.value}e${body.slice(body.search(/e/i) + 1)}`);
    return Number.isFinite(value) ? { ok: true, value } : refuse(field, `${shown} is too large`);
  }
  if (exponentForm) return refuse(field, `${shown}: write the number in full, without an exponent`);
  // Digits with spaces, apostrophes or underscores between them: a thousands grouping (anything else is just not a number).
  if (/[\s'\u00a0\u202f_]/.test(body)) {
    return /^\d[\d.,\s'\u00a0\u202f_]*$/.test(body) ? refuse(field, `${shown}: write the number without spaces or thousands groupings`) : refuse(field, `${shown} is not a number`);
  }

  // The separator of the other convention: ambiguous when it can read as a thousands grouping.
  if (body.includes(other)) {
    const grouped = new RegExp(`^\\d{1,3}(\\${other}\\d{3})+$`);
    if (grouped.test(body)) {
      const asThousands = sign + body.split(other).join('');
      const parts = body.split(other);
      // Read as a decimal only when there is one mark ("1,250" → 1.25); several marks are groupings alone.
      const asDecimal = parts.length === 2 ? sign + trimDecimal(`${parts[0]}${decimalSeparator}${parts[1]}`, decimalSeparator) : null;
      return refuse(
        field,
        asDecimal
          ? `${shown} — use ${asThousands} or ${asDecimal} (the decimal separator is ${SEPARATOR_WORD[decimalSeparator]})`
          : `${shown} — use ${asThousands} without thousands groupings (the decimal separator is ${SEPARATOR_WORD[decimalSeparator]})`,
      );
    }
    const suggestion = body.includes(decimalSeparator) ? null : sign + body.split(other).join(decimalSeparator);
    return refuse(
      field,
      `${shown} — the decimal separator is ${SEPARATOR_WORD[decimalSeparator]}${suggestion && body.split(other).length === 2 ? `: write ${suggestion}` : ''}`,
    );
  }
  const number = new RegExp(`^(\\d+(\\${decimalSeparator}\\d*)?|\\${decimalSeparator}\\d+)$`);
  if (!number.test(body)) return refuse(field, `${shown} is not a number`);
  const value = Number(sign + body.replace(decimalSeparator, '.'));
  // Digits alone cannot overflow to Infinity below 309 of them; a text that long is refused all the same.
  if (!Number.isFinite(value)) return refuse(field, `${shown} is too large`);
  return { ok: true, value: Object.is(value, -0) ? 0 : value };
}

/** "1,250" read as a decimal keeps its digits but drops trailing zeros: 1.250 → 1.25. */
function trimDecimal(text: string, separator: DecimalSeparator): string {
  const [whole, fraction = ''] = text.split(separator);
  const kept = fraction.replace(/0+$/, '');
  return kept === '' ? whole : `${whole}${separator}${kept}`;
}

/**
 * A cell of an uploaded file: an XLSX number as it is (the spreadsheet stored a number, there is
 * nothing to read), a text through `parseNumber`. Blank gives `{ ok: false, empty: true }`.
 */
export function parseNumberCell(raw: unknown, options: ParseNumberOptions): ParsedNumber {
  if (raw === null || raw === undefined) return refuse(options.field, 'enter a number', true);
  if (typeof raw === 'number') return Number.isFinite(raw) ? { ok: true, value: raw } : refuse(options.field, 'is not a finite number');
  if (typeof raw !== 'string') return refuse(options.field, 'is not a number');
  return parseNumber(raw, options);
}

/** A number written with the separator, for putting back into a field or a message (no grouping). */
export function writeNumber(text: string, separator: DecimalSeparator): string {
  return separator === '.' ? text : text.replace('.', ',');
}

/**
 * The decimal separator of a locale (the browser's, when the user never chose one), as
 * Intl.NumberFormat writes 1.5. Anything but a comma reads as a point.
 */
export function decimalSeparatorOfLocale(locale?: string | readonly string[]): DecimalSeparator {
  try {
    const parts = new Intl.NumberFormat(locale as string | string[] | undefined).formatToParts(1.5);
    return parts.find((p) => p.type === 'decimal')?.value === ',' ? ',' : '.';
  } catch {
    return '.';
  }
}

export function isDecimalSeparator(value: unknown): value is DecimalSeparator {
  return value === '.' || value === ',';
}

/**
 * The decimal separator of a CSV file from its delimiter: a comma-delimited file cannot write
 * decimal commas without quoting, so it uses points; a semicolon-delimited file is the usual
 * export where the comma is the decimal mark (common practice); otherwise (tab, one column) the
 * user's own separator.
 */
export function decimalSeparatorOfDelimiter(delimiter: string | undefined, userSeparator: DecimalSeparator): DecimalSeparator {
  if (delimiter === ',') return '.';
  if (delimiter === ';') return ',';
  return userSeparator;
}
