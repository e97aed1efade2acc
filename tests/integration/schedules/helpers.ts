/**
 * Helpers of the schedule integration tests: a small team catalogue (a few sizes per family, so
 * the tests stay fast), schedule files built from circuit rows, and worker processes spawned
 * with the test's DATABASE_URL whose JSON lines are collected.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import Papa from 'papaparse';
import { getDb } from '@/db/client';
import { copyCatalogueRowsToTeam } from '@/db/queries/catalogue';
import { STANDARD_CATALOGUE } from '@/db/seed/catalogue';
import { SCHEDULE_COLUMNS } from '@/lib/schedule';

/** Copper XLPE 16–95 mm² and copper PVC 16–70 mm² single-core builds of the standard catalogue, with what they need. */
export async function seedSmallCatalogue(teamId: string) {
  const builds = (STANDARD_CATALOGUE.builds as ReadonlyArray<{ key: string; conductorKey: string }>).filter((b) =>
    /^demo-cu-(16|25|35|50|70|95)-xlpe-pvc$|^demo-cu-(16|35|70)-pvc-pvc$/.test(b.key),
  );
  const conductorKeys = new Set(builds.map((b) => b.conductorKey));
  const conductors = (STANDARD_CATALOGUE.conductors as ReadonlyArray<{ key: string }>).filter((c) => conductorKeys.has(c.key));
  await getDb().transaction((tx) =>
    copyCatalogueRowsToTeam(tx, teamId, { materials: [...STANDARD_CATALOGUE.materials], coverings: [...STANDARD_CATALOGUE.coverings], conductors, builds }),
  );
}

export type Cells = Partial<Record<(typeof SCHEDULE_COLUMNS)[number]['field'], string | number | null>>;

/**
 * Circuit rows with varied inputs (currents, lengths, installations, faults). These are inputs
 * only; the checks compare the stored results with the sizing library run on each row alone.
 */
export function circuitRows(count: number, prefix = 'C'): Cells[] {
  const rows: Cells[] = [];
  for (let i = 0; i < count; i++) {
    const buried = i % 4 === 3;
    rows.push({
      circuitTag: `${prefix}-${String(i + 1).padStart(4, '0')}`,
      from: 'MSB-1',
      to: `Load ${i + 1}`,
      designCurrentA: 20 + ((i * 37) % 180),
      nominalVoltageV: 230,
      phases: i % 5 === 0 ? 1 : 3,
      frequencyHz: 50,
      lengthM: 10 + ((i * 13) % 90),
      powerFactor: 0.85,
      installation: buried ? 'buried' : 'cable in air',
      depthM: buried ? 0.7 : null,
      ambientC: buried ? 20 : 30 + (i % 3) * 5,
      faultCurrentKA: i % 3 === 0 ? null : 4,
      clearingTimeS: i % 3 === 0 ? null : 0.1,
      family: i % 6 === 5 ? 'copper PVC single-core' : 'copper XLPE single-core',
      maxVoltageDropPercent: i % 2 === 0 ? 5 : null,
      maxParallel: 1,
    });
  }
  return rows;
}

export function scheduleCsv(rows: readonly Cells[]): Uint8Array {
  const headers = SCHEDULE_COLUMNS.map((c) => c.header);
  const data = rows.map((row) => SCHEDULE_COLUMNS.map((c) => row[c.field] ?? ''));
  return new TextEncoder().encode(Papa.unparse({ fields: headers, data }, { newline: '\r\n' }));
}

export interface WorkerProcess {
  child: ChildProcess;
  lines: Array<Record<string, unknown>>;
  ready: Promise<void>;
  exited: Promise<number | null>;
  /** Row numbers this process reported as stored. */
  stored(): number[];
}

/** A real worker process (scripts/worker.ts) against the test database, with fast expiry for crash tests. */
export function spawnWorker(workerId: string, env: Record<string, string> = {}): WorkerProcess {
  const root = path.resolve(import.meta.dirname, '../../..');
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/worker.ts'], {
    cwd: root,
    env: {
      ...process.env,
      WORKER_ID: workerId,
      SCHEDULE_POLL_SECONDS: '0.5',
      SCHEDULE_MAINTENANCE_SECONDS: '1',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: Array<Record<string, unknown>> = [];
  let buffer = '';
  let markReady: () => void = () => {};
  let failReady: (e: Error) => void = () => {};
  const ready = new Promise<void>((resolve, reject) => {
    markReady = resolve;
    failReady = reject;
  });
  let stderr = '';
  child.stderr!.on('data', (chunk) => (stderr += String(chunk)));
  child.stdout!.on('data', (chunk) => {
    buffer += String(chunk);
    let at: number;
    while ((at = buffer.indexOf('\n')) >= 0) {
      const line = buffer.slice(0, at).trim();
      buffer = buffer.slice(at + 1);
      if (!line.startsWith('{')) continue;
      const parsed = JSON.parse(line) as Record<string, unknown>;
      lines.push(parsed);
      if (parsed.event === 'ready') markReady();
    }
  });
  const exited = new Promise<number | null>((resolve) => {
    child.on('exit', (code) => {
      failReady(new Error(`worker ${workerId} exited (${code}) before it was ready: ${stderr.slice(-2000)}`));
      resolve(code);
    });
  });
  return {
    child,
    lines,
    ready,
    exited,
    stored: () => lines.filter((l) => l.event === 'batch').flatMap((l) => l.stored as number[]),
  };
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs: number, everyMs = 100): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
