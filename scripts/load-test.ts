/**
 * `npm run test:load` (not in CI): autocannon against the production build on loopback — 50
 * connections for 60 s on POST /api/v1/evaluate, then on the sizing sheet page. Prints requests,
 * errors, p50/p99 latency, throughput and the server's memory before and after; exits 1 on any
 * error or non-2xx answer. Target: `npm start` (or APP_URL, DATABASE_URL, NEXTAUTH_SECRET).
 * LOAD_DURATION_S and LOAD_CONNECTIONS change the defaults.
 */
import autocannon from 'autocannon';
import { EXAMPLE_EVALUATE_REQUEST } from '@/lib/api/examples';
import { prepareTarget, serverRssMiB } from './lib/benchTarget';

const DURATION_S = Number(process.env.LOAD_DURATION_S ?? 60);
const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 50);

function fmt(value: number, digits = 1): string {
  return value.toFixed(digits);
}

async function main() {
  const target = await prepareTarget();
  let failed = false;
  try {
    const runs = [
      {
        name: 'POST /api/v1/evaluate (2 cable candidates)',
        options: {
          url: `${target.appUrl}/api/v1/evaluate`,
          method: 'POST' as const,
          headers: { authorization: `Bearer ${target.token}`, 'content-type': 'application/json' },
          body: JSON.stringify(EXAMPLE_EVALUATE_REQUEST),
        },
      },
      { name: `GET ${target.sheetPath} (sizing sheet page)`, options: { url: `${target.appUrl}${target.sheetPath}`, headers: { cookie: target.cookie } } },
    ];
    console.log(`load test: ${CONNECTIONS} connections × ${DURATION_S} s per run against ${target.appUrl} (server pid ${target.serverPid ?? 'unknown'})`);
    for (const run of runs) {
      const before = serverRssMiB(target.serverPid);
      const result = await autocannon({ ...run.options, connections: CONNECTIONS, duration: DURATION_S });
      const after = serverRssMiB(target.serverPid);
      const problems = result.errors + result.timeouts + result.non2xx;
      failed ||= problems > 0;
      console.log(
        [
          `\n${run.name}`,
          `  requests ${result.requests.total} (2xx ${result['2xx']}, non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts})`,
          `  throughput ${fmt(result.requests.average)} req/s, ${fmt(result.throughput.average / 1024 / 1024, 2)} MiB/s`,
          `  latency p50 ${result.latency.p50} ms, p90 ${result.latency.p90} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms`,
          `  server memory (RSS) before ${before === null ? 'n/a' : `${fmt(before)} MiB`}, after ${after === null ? 'n/a' : `${fmt(after)} MiB`}`,
          `  ${problems === 0 ? 'zero errors' : `${problems} FAILED REQUESTS`}`,
        ].join('\n'),
      );
    }
  } finally {
    await target.done();
  }
  process.exit(failed ? 1 : 0);
}

main().catch((error) => {
  console.error(`load test: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
