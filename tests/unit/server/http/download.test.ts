// One download helper for every file route (issue 19, Low): RFC 6266 §4.3 — an ASCII `filename`
// for old clients and `filename*` (RFC 8187 ext-value, UTF-8 percent-encoded) with the real name.
// A header value may only hold code points up to U+00FF (Fetch standard); the old routes wrote the
// raw name and so answered 500 for a name such as "Łódź".
import { describe, expect, it } from 'vitest';
import { contentDisposition, downloadResponse } from '@/server/http/download';

describe('contentDisposition', () => {
  it('RFC 6266 §5 example: "€ rates" becomes filename*=UTF-8\'\'%e2%82%ac%20rates (hex case does not matter)', () => {
    expect(contentDisposition('€ rates').toLowerCase()).toBe(`attachment; filename="_ rates"; filename*=utf-8''%e2%82%ac%20rates`);
  });

  it('a plain ASCII name is sent once, quoted', () => {
    expect(contentDisposition('sizing-sheet-MSB-rev2.pdf', 'inline')).toBe('inline; filename="sizing-sheet-MSB-rev2.pdf"');
  });

  it('quotes, backslashes, slashes and control characters never reach the header; attr-char rules hold', () => {
    const value = contentDisposition('a"b\\c/d\r\ne\'(1)*.csv');
    expect(value).not.toMatch(/[\r\n]/);
    expect(value).toMatch(/^attachment; filename="[^"\\]*"; filename\*=UTF-8''[A-Za-z0-9!#$&+\-.^_`|~%]*$/);
    expect(decodeURIComponent(value.split("''")[1])).toBe("a_b_c_d_e'(1)*.csv");
  });

  it('a name with characters above U+00FF makes a valid Response whose header decodes to the name', () => {
    const name = 'Kabelliste Łódź – Schaltanlage 3.xlsx';
    const response = downloadResponse(new Uint8Array([1, 2, 3]), { fileName: name, kind: 'original' });
    const header = response.headers.get('content-disposition')!;
    expect(decodeURIComponent(header.split("filename*=UTF-8''")[1])).toBe(name);
    expect(response.headers.get('cache-control')).toBe('private, no-store');
  });

  it('CSV answers start with a BOM so spreadsheets read UTF-8; binary bodies are untouched', async () => {
    expect(new Uint8Array(await downloadResponse('a,b', { fileName: 'x.csv', kind: 'csv' }).arrayBuffer()).slice(0, 3)).toEqual(new Uint8Array([0xef, 0xbb, 0xbf]));
    expect(new Uint8Array(await downloadResponse(new Uint8Array([9]), { fileName: 'x.xlsx', kind: 'xlsx' }).arrayBuffer())).toEqual(new Uint8Array([9]));
  });
});
