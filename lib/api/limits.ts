/**
 * Limits of the calculation API (v1). One place, so the route handlers, the OpenAPI document, the
 * documentation page and the tests quote the same numbers.
 */

/** Largest request body accepted, bytes. A full batch of rich cable candidates stays well under it. */
export const MAX_REQUEST_BYTES = 256 * 1024;

/** Candidates in one `POST /api/v1/evaluate` (the same cap as a sizing sheet). */
export const MAX_CANDIDATES_PER_REQUEST = 24;

/** Coverings of one cable, conductor outwards. Real cables have fewer than ten. */
export const MAX_LAYERS_PER_CABLE = 12;

/** Source notes on one candidate, and their length. */
export const MAX_SOURCE_NOTES = 20;
export const MAX_NOTE_CHARS = 500;

/** Identifiers and labels echoed back in the results. */
export const MAX_ID_CHARS = 120;
export const MAX_LABEL_CHARS = 200;

/** Default and highest per-token rate, requests per minute (admins choose per token). */
export const DEFAULT_REQUESTS_PER_MINUTE = 120;
export const MAX_REQUESTS_PER_MINUTE = 100_000;

/** Version of the API's request and answer shapes; bumped only for breaking changes. */
export const API_VERSION = 'v1' as const;
