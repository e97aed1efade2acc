/**
 * `npm run test:load` (not in CI): autocannon against the production build on loopback — 50
 * connections on GET /api/health (the baseline: one database round trip), POST /api/v1/evaluate,
 * then the sizing sheet page, 60 s each by default. Prints requests, errors, p50/p99 latency,
 * throughput, the server's memory before and after, the machine's load average, and the two
 * figures the project holds itself to: evaluate at least half the health throughput, and the
 * sheet page at least 50 requests a second. Exits 1 on any error or non-2xx answer.
 * Target: `npm start` (or APP_URL, DATABASE_URL, NEXTAUTH_SECRET).
 *
 *   npm run test:load                  # 60 s per run
 *   npm run test:load -- --duration 20 # shorter runs (also LOAD_DURATION_S)
 *   LOAD_CONNECTIONS=50                # connections (default 50)
 */
import os from 'node:os';
import autocannon from 'autocannon';
import { EXAMPLE_EVALUATE_REQUEST } from '@/lib/api/examples';
import { prepareTarget, serverRssMiB } from './lib/benchTarget';

function durationFromArgs(argv: readonly string[]): number | undefined {
  const at = argv.findIndex((a) => a === '--duration' || a === '--seconds' || a.startsWith('--duration=') || a.startsWith('--seconds='));
  if (at < 0) return undefined;
  const raw = argv[at].includes('=') ? argv[at].split('=')[1] : argv[at + 1];
  const value = Number(raw);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`--duration needs a number of seconds, got "${raw}"`);
  return value;
}

const DURATION_S = durationFromArgs(process.argv.slice(2)) ?? Number(process.env.LOAD_DURATION_S ?? 60);
const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 50);
/** The targets (issue 19): evaluate ≥ 0.5 × health throughput; the sheet page ≥ 50 req/s at 50 connections. */
const EVALUATE_TO_HEALTH_MIN = 0.5;
const SHEET_PAGE_MIN_RPS = 50;

function fmt(value: number, digits = 1): string {
  return value.toFixed(digits);
}

function loadAverage(): string {
  return os.loadavg().map((v) => v.toFixed(2)).join(', ');
}

async function main() {
  const target = await prepareTarget();
  let failed = false;
  const throughput: Record<string, number> = {};
  try {
    const runs = [
      { key: 'health', name: 'GET /api/health (one database round trip)', options: { url: `${target.appUrl}/api/health` } },
      {
        key: 'evaluate',
        name: 'POST /api/v1/evaluate (2 cable candidates)',
        options: {
          url: `${target.appUrl}/api/v1/evaluate`,
          method: 'POST' as const,
          headers: { authorization: `Bearer ${target.token}`, 'content-type': 'application/json' },
          body: JSON.stringify(EXAMPLE_EVALUATE_REQUEST),
        },
      },
      { key: 'sheet', name: `GET ${target.sheetPath} (sizing sheet page)`, options: { url: `${target.appUrl}${target.sheetPath}`, headers: { cookie: target.cookie } } },
    ];
    console.log(`load test: ${CONNECTIONS} connections × ${DURATION_S} s per run against ${target.appUrl} (server pid ${target.serverPid ?? 'unknown'}); ${os.cpus().length} CPUs, load average ${loadAverage()}`);
    for (const run of runs) {
      const before = serverRssMiB(target.serverPid);
      const result = await autocannon({ ...run.options, connections: CONNECTIONS, duration: DURATION_S });
      const after = serverRssMiB(target.serverPid);
      const problems = result.errors + result.timeouts + result.non2xx;
      failed ||= problems > 0;
      throughput[run.key] = result.requests.average;
      console.log(
        [
          `\n${run.name}`,
          `  requests ${result.requests.total} (2xx ${result['2xx']}, non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts})`,
          `  throughput ${fmt(result.requests.average)} req/s, ${fmt(result.throughput.average / 1024 / 1024, 2)} MiB/s`,
          `  latency p50 ${result.latency.p50} ms, p90 ${result.latency.p90} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms`,
          `  server memory (RSS) before ${before === null ? 'n/a' : `${fmt(before)} MiB`}, after ${after === null ? 'n/a' : `${fmt(after)} MiB`}`,
          `  load average after the run ${loadAverage()}`,
          `  ${problems === 0 ? 'zero errors' : `${problems} FAILED REQUESTS`}`,
        ].join('\n'),
      );
    }
    const ratio = throughput.evaluate / throughput.health;
    console.log(
      [
        '\nfigures',
        `  evaluate / health throughput ${fmt(ratio, 2)} (${fmt(throughput.evaluate)} / ${fmt(throughput.health)} req/s; target ≥ ${EVALUATE_TO_HEALTH_MIN}) ${ratio >= EVALUATE_TO_HEALTH_MIN ? 'met' : 'NOT MET'}`,
        `  sheet page ${fmt(throughput.sheet)} req/s at ${CONNECTIONS} connections (target ≥ ${SHEET_PAGE_MIN_RPS}) ${throughput.sheet >= SHEET_PAGE_MIN_RPS ? 'met' : 'NOT MET'}`,
        `  load average ${loadAverage()} (1, 5, 15 min) on ${os.cpus().length} CPUs shared with other work`,
      ].join('\n'),
    );
  } finally {
    await target.done();
  }
  process.exit(failed ? 1 : 0);
}

main().catch((error) => {
  console.error(`load test: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
