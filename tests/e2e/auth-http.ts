/**
 * HTTP helpers for the browser-less e2e tests of sign-in and the endpoint matrix: a cookie jar,
 * sign-in through next-auth's own credentials callback (CSRF token and all), and server-action
 * calls encoded by React's own client encoder, against the production build at APP_URL.
 */
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { appUrl } from '../helpers/browser';

export class CookieJar {
  private cookies = new Map<string, string>();

  store(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const separator = pair.indexOf('=');
      const name = pair.slice(0, separator).trim();
      const value = pair.slice(separator + 1).trim();
      const expired = attributes.some((a) => /^\s*max-age=0\s*$/i.test(a) || /^\s*expires=Thu, 01 Jan 1970/i.test(a));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  get(name: string): string | undefined {
    return this.cookies.get(name);
  }

  clone(): CookieJar {
    const copy = new CookieJar();
    copy.cookies = new Map(this.cookies);
    return copy;
  }
}

export interface HttpClient {
  jar: CookieJar;
  request(pathname: string, init?: { method?: string; body?: unknown; headers?: Record<string, string> }): Promise<Response>;
}

export function httpClient(jar = new CookieJar()): HttpClient {
  return {
    jar,
    async request(pathname, init = {}) {
      const headers: Record<string, string> = { origin: new URL(appUrl()).origin, ...init.headers };
      const cookie = jar.header();
      if (cookie) headers.cookie = cookie;
      let body: string | undefined;
      if (init.body !== undefined) {
        headers['content-type'] ??= 'application/json';
        body = typeof init.body === 'string' ? init.body : JSON.stringify(init.body);
      }
      const response = await fetch(appUrl(pathname), { method: init.method ?? 'GET', headers, body, redirect: 'manual' });
      jar.store(response);
      return response;
    },
  };
}

export interface SignInAnswer {
  client: HttpClient;
  /** The `error` next-auth put in its answer URL (CredentialsSignin, limited:<s>), or null on success. */
  error: string | null;
  signedIn: boolean;
}

/** Signs in as a browser would through next-auth's credentials callback. */
export async function signInOverHttp(email: string, password: string): Promise<SignInAnswer> {
  const client = httpClient();
  const csrf = (await (await client.request('/api/auth/csrf')).json()) as { csrfToken: string };
  const form = new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: 'true', callbackUrl: '/projects' });
  const response = await client.request('/api/auth/callback/credentials', {
    method: 'POST',
    body: form.toString(),
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
  });
  const answer = (await response.json().catch(() => ({}))) as { url?: string };
  const error = answer.url ? new URL(answer.url).searchParams.get('error') : 'no answer';
  const signedIn = Boolean(client.jar.get('next-auth.session-token') ?? client.jar.get('__Secure-next-auth.session-token'));
  return { client, error, signedIn };
}

/** Where the build under test keeps its manifests (scripts/test.sh builds into NEXT_DIST_DIR). */
function distDir(): string {
  return path.resolve(process.env.NEXT_DIST_DIR ?? '.next');
}

export interface ActionManifestEntry {
  id: string;
  filename: string;
  exportedName: string;
  workers: string[];
}

/** The server actions of the build, with the pages that can run them. */
export function readActionManifest(): ActionManifestEntry[] {
  const manifest = JSON.parse(fs.readFileSync(path.join(distDir(), 'server', 'server-reference-manifest.json'), 'utf8')) as {
    node: Record<string, { filename?: string; exportedName?: string; workers: Record<string, unknown> }>;
  };
  return Object.entries(manifest.node).map(([id, entry]) => ({
    id,
    filename: entry.filename ?? '',
    exportedName: entry.exportedName ?? '',
    workers: Object.keys(entry.workers),
  }));
}

/** `/projects/00000000-…` from the worker `app/(workspace)/projects/[projectId]/page`. */
export function pagePathOfWorker(worker: string): string {
  const segments = worker
    .replace(/^app\//, '')
    .replace(/\/?page$/, '')
    .split('/')
    .filter((s) => s && !/^\(.*\)$/.test(s))
    .map((s) => (/^\[.*\]$/.test(s) ? '00000000-0000-4000-8000-000000000000' : s));
  return `/${segments.join('/')}`;
}

const requireFromRoot = createRequire(path.resolve('package.json'));

/** Calls a server action the way Next's client does: POST to a page that uses it, `Next-Action` header. */
export async function callAction(client: HttpClient, action: ActionManifestEntry, args: unknown[]): Promise<Response> {
  const { encodeReply } = requireFromRoot('next/dist/compiled/react-server-dom-webpack/client.node.js') as {
    encodeReply(value: unknown): Promise<string | FormData>;
  };
  const encoded = await encodeReply(args);
  const worker = [...action.workers].sort((a, b) => (a.includes('[') ? 1 : 0) - (b.includes('[') ? 1 : 0))[0];
  const headers: Record<string, string> = {
    origin: new URL(appUrl()).origin,
    'next-action': action.id,
    accept: 'text/x-component',
  };
  const cookie = client.jar.header();
  if (cookie) headers.cookie = cookie;
  if (typeof encoded === 'string') headers['content-type'] = 'text/plain;charset=UTF-8';
  const response = await fetch(appUrl(pagePathOfWorker(worker)), { method: 'POST', headers, body: encoded, redirect: 'manual' });
  client.jar.store(response);
  return response;
}
