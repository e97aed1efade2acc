/**
 * Pages while PostgreSQL cannot be reached: 503 with a page that says "Database unavailable",
 * as the API answers 503 `database_unavailable` (server/http/errors.ts). A page cannot choose its
 * own status in the App Router, and once a page has started rendering its status is 200 or 500,
 * so the check happens in proxy.ts before any page renders: one `select 1` through the app's
 * pool, its answer kept for a second (so a page costs no extra round trip under load), shared by
 * the requests that arrive while it runs. A page that meets the outage mid-render marks the
 * database as down at once (instrumentation.ts onRequestError), so the next request is answered
 * 503 without waiting for the second to pass.
 */
import { getPool } from '@/db/client';

const UP_FOR_MS = 1000;
const DOWN_FOR_MS = 500;
const PROBE_TIMEOUT_MS = 2500;

interface GateState {
  reachable: boolean;
  checkedAt: number;
  probe: Promise<boolean> | null;
}

const holder = globalThis as unknown as { ampwardenDatabaseGate?: GateState };

function state(): GateState {
  holder.ampwardenDatabaseGate ??= { reachable: true, checkedAt: 0, probe: null };
  return holder.ampwardenDatabaseGate;
}

async function probe(): Promise<boolean> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  try {
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error('database probe timed out')), PROBE_TIMEOUT_MS);
    });
    await Promise.race([getPool().query('select 1'), timeout]);
    return true;
  } catch {
    return false;
  } finally {
    if (timer) clearTimeout(timer);
  }
}

export async function databaseReachable(now = Date.now()): Promise<boolean> {
  const gate = state();
  const freshFor = gate.reachable ? UP_FOR_MS : DOWN_FOR_MS;
  if (now - gate.checkedAt < freshFor) return gate.reachable;
  gate.probe ??= probe().then((reachable) => {
    gate.reachable = reachable;
    gate.checkedAt = Date.now();
    gate.probe = null;
    return reachable;
  });
  return gate.probe;
}

/** A request just failed because the database is unreachable: answer the next ones 503 at once. */
export function markDatabaseDown(): void {
  const gate = state();
  gate.reachable = false;
  gate.checkedAt = Date.now();
}

const PAGE = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="10">
<title>Database unavailable — Ampwarden</title>
<style>body{font-family:system-ui,sans-serif;color:#233040;background:#f7f5f0;margin:0}main{max-width:36rem;margin:5rem auto;padding:0 1.5rem}h1{font-size:1.5rem}p{line-height:1.5}</style>
</head>
<body>
<main role="alert">
<h1>Database unavailable</h1>
<p>Ampwarden cannot reach its database just now, so this page cannot be shown. Nothing you saved is lost. This page tries again by itself every 10 seconds.</p>
</main>
</body>
</html>
`;

export function databaseUnavailablePage(): Response {
  return new Response(PAGE, {
    status: 503,
    headers: { 'content-type': 'text/html; charset=utf-8', 'retry-after': '5', 'cache-control': 'no-store' },
  });
}
