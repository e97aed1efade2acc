/**
 * The one way every route hands out a file (catalogue exports and templates, import originals,
 * schedule files, templates and results, candidate exports, PDF sizing sheets, the verification
 * report): content type, Content-Disposition with the file name, no caching of team data.
 *
 * The file name goes out twice, as RFC 6266 §4.3 recommends: `filename="…"` in plain ASCII for old
 * clients (anything else replaced by `_`), and `filename*=UTF-8''…` with the real name
 * percent-encoded (RFC 8187 §3.2), which current browsers prefer. A header value may only hold
 * bytes up to U+00FF (Fetch "header value"), so a name such as "Kabelliste Łódź.xlsx" written raw
 * would make the whole answer fail.
 */
export type DownloadKind = 'csv' | 'xlsx' | 'pdf' | 'original';

export const CONTENT_TYPES: Readonly<Record<DownloadKind, string>> = {
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
  // An uploaded original is handed back as bytes to save, never to be rendered by the browser.
  original: 'application/octet-stream',
};

const MAX_NAME_CHARS = 150;

/** The name without control characters, path separators or quotes, and not longer than 150 characters. */
export function cleanFileName(name: string, fallback = 'download'): string {
  const cleaned = [...name.normalize('NFC').replace(/[\u0000-\u001f\u007f"\\/]+/g, '_').trim()].slice(0, MAX_NAME_CHARS).join('');
  return cleaned.replace(/^\.+/, '') || fallback;
}

/** The ASCII fallback of RFC 6266 §4.3: letters, digits and a few safe marks; everything else `_`. */
export function asciiFileName(name: string): string {
  return name.replace(/[^A-Za-z0-9._ ()+,-]/g, '_');
}

/** RFC 8187 ext-value: UTF-8, percent-encoded except attr-char. */
function extValue(name: string): string {
  return `UTF-8''${encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)}`;
}

export function contentDisposition(fileName: string, disposition: 'attachment' | 'inline' = 'attachment'): string {
  const name = cleanFileName(fileName);
  const ascii = asciiFileName(name);
  return ascii === name ? `${disposition}; filename="${ascii}"` : `${disposition}; filename="${ascii}"; filename*=${extValue(name)}`;
}

export interface DownloadOptions {
  fileName: string;
  kind: DownloadKind;
  disposition?: 'attachment' | 'inline';
  /** Defaults to `private, no-store`: these files hold a team's data. */
  cacheControl?: string;
  headers?: Record<string, string>;
}

export function downloadResponse(body: string | Uint8Array, options: DownloadOptions): Response {
  // A BOM so that spreadsheet programs read a CSV (units such as mm², °C, Ω) as UTF-8.
  const payload = typeof body === 'string' ? (options.kind === 'csv' && !body.startsWith('\uFEFF') ? `\uFEFF${body}` : body) : new Uint8Array(body);
  return new Response(payload as BodyInit, {
    headers: {
      'content-type': CONTENT_TYPES[options.kind],
      'content-disposition': contentDisposition(options.fileName, options.disposition),
      'cache-control': options.cacheControl ?? 'private, no-store',
      'x-content-type-options': 'nosniff',
      ...options.headers,
    },
  });
}
