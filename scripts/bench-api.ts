/**
 * `npm run bench:api`: throughput and latency of POST /api/v1/evaluate against GET /api/health on
 * the same server in the same run (their ratio is what the computation costs over the framework and
 * one database round trip), and the first-load JavaScript of the sizing sheet page from the build.
 * Target: `npm start` (or APP_URL, DATABASE_URL, NEXTAUTH_SECRET; NEXT_DIST_DIR for the build).
 * BENCH_DURATION_S and BENCH_CONNECTIONS change the defaults (10 connections, 20 s each).
 */
import autocannon from 'autocannon';
import { EXAMPLE_EVALUATE_REQUEST } from '@/lib/api/examples';
import { prepareTarget, sheetFirstLoadJs } from './lib/benchTarget';

const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 20);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10);

async function main() {
  const target = await prepareTarget();
  try {
    const measure = async (name: string, options: autocannon.Options) => {
      const result = await autocannon({ ...options, connections: CONNECTIONS, duration: DURATION_S });
      const bad = result.errors + result.timeouts + result.non2xx;
      console.log(`${name.padEnd(44)} ${result.requests.average.toFixed(1).padStart(8)} req/s   p50 ${String(result.latency.p50).padStart(4)} ms   p99 ${String(result.latency.p99).padStart(4)} ms${bad ? `   (${bad} failed)` : ''}`);
      return result.requests.average;
    };
    console.log(`bench:api — ${CONNECTIONS} connections × ${DURATION_S} s each against ${target.appUrl}`);
    const health = await measure('GET /api/health (framework + 1 DB round trip)', { url: `${target.appUrl}/api/health` });
    const evaluate = await measure('POST /api/v1/evaluate (2 cable candidates)', {
      url: `${target.appUrl}/api/v1/evaluate`,
      method: 'POST',
      headers: { authorization: `Bearer ${target.token}`, 'content-type': 'application/json' },
      body: JSON.stringify(EXAMPLE_EVALUATE_REQUEST),
    });
    console.log(`ratio evaluate / health throughput: ${(evaluate / health).toFixed(3)}`);
    const js = sheetFirstLoadJs();
    console.log(
      js
        ? `first-load JavaScript of /sheets/[sheetId]: ${js.files} files, ${js.rawKiB.toFixed(0)} KiB raw, ${js.gzipKiB.toFixed(0)} KiB gzip (from ${process.env.NEXT_DIST_DIR ?? '.next'})`
        : `first-load JavaScript: no build manifests in ${process.env.NEXT_DIST_DIR ?? '.next'} (build first)`,
    );
  } finally {
    await target.done();
  }
}

main().catch((error) => {
  console.error(`bench:api: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
