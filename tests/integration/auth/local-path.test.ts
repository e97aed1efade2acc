// Where the app sends a browser after signing in: only its own paths (issue 6, open-redirect guard).
import { describe, expect, it } from 'vitest';
import { isSafeLocalPath } from '@/server/http/localPath';

describe('isSafeLocalPath', () => {
  it.each(['/projects', '/sheets/0b8f?tab=flags', '/admin/members'])('accepts %s', (path) => {
    expect(isSafeLocalPath(path)).toBe(true);
  });

  // Browsers read `//host` and `/\host` as another host (WHATWG URL parsing treats \ like / for http).
  it.each(['//evil.example', '/\\evil.example', 'https://evil.example/', 'projects', '', '/x\n/y', null])('refuses %j', (path) => {
    expect(isSafeLocalPath(path)).toBe(false);
  });
});
