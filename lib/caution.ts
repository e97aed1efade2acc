/**
 * The standing caution (../shared/design/product.md, "Cautions"). Shown on every sheet, print and
 * share view (components/shell/CautionNotice, the PDF, the share page, the candidate exports, the
 * mail); the wording is ours and must not be shortened away. Plain text here so that the browser
 * and the server print the same words.
 */
export const CAUTION_TEXT = [
  'Ampwarden is an engineering aid. Its results depend on the assumptions listed with them.',
  'The installation must comply with the applicable wiring rules and standards (IEC 60364 and national codes) and with local authority requirements.',
  'A qualified, licensed engineer must check and sign this sizing sheet before it is used for construction.',
] as const;
