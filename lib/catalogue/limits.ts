/** Import limits, shared by the browser's early check and the server's (lib/catalogue/files). */
/** Large enough for several thousand rows; a bigger file is almost certainly not a catalogue sheet. */
export const MAX_IMPORT_BYTES = 2 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 5000;
