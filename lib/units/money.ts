/**
 * Money as people read it: every amount names the team's currency (teams.currency, ISO 4217),
 * rounded to cents for reading and exporting. Amounts are decimal strings inside (decimal.js,
 * PostgreSQL numeric); changing the team's currency relabels, it never converts.
 */
import Decimal from 'decimal.js';

/** ISO 4217 codes a team may choose: three capital letters (the database checks the same). */
export const CURRENCY_PATTERN = /^[A-Z]{3}$/;

/** The choices the settings offer; any other ISO 4217 code can be typed. */
export const COMMON_CURRENCIES = ['EUR', 'USD', 'GBP', 'CHF', 'SEK', 'NOK', 'DKK', 'PLN', 'CZK', 'CAD', 'AUD', 'NZD', 'JPY', 'CNY', 'INR', 'ZAR', 'BRL', 'AED', 'SGD'] as const;

/** An amount rounded to cents as a number (for XLSX numeric cells and CSV), or null. */
export function moneyNumber(amount: string | number | null | undefined): number | null {
  if (amount === null || amount === undefined || amount === '') return null;
  try {
    const d = new Decimal(amount);
    return d.isFinite() ? d.toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toNumber() : null;
  } catch {
    return null;
  }
}

/** "12 345.60 EUR": cents, a thin grouping space people read easily (not a decimal mark in any convention), the code after. */
export function formatMoney(amount: string | number | null | undefined, currency: string): string {
  const n = moneyNumber(amount);
  if (n === null) return '—';
  const [whole, cents] = Math.abs(n).toFixed(2).split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f');
  return `${n < 0 ? '−' : ''}${grouped}.${cents} ${currency}`;
}

/** A header or label with its currency: "material cost (EUR)". */
export function withCurrency(label: string, currency: string): string {
  return `${label} (${currency})`;
}
