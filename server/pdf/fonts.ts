/**
 * The fonts every Ampwarden PDF embeds: IBM Plex Sans (latin, with the Greek subset as a fallback
 * for ρ, α, Ω…), registered once per process by the verification report's module, reused here so
 * that both documents share one registration (react-pdf keeps a global font store).
 */
export { registerReportFonts as registerPdfFonts } from './VerificationReportDocument';
export { pdfSafeText } from './pdfText';

/** The family list to put in a page style: latin first, Greek symbols from the fallback. */
export const PDF_FONT_FAMILY = ['Plex Sans', 'Plex Sans Greek'];
