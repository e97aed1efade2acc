import Link from 'next/link';
import { compareCandidates } from '@/lib/electrical';
import {
  API_CAUTION,
  DEFAULT_REQUESTS_PER_MINUTE,
  EXAMPLE_AMPACITY_REQUEST,
  EXAMPLE_BUSBAR_SYSTEM_REQUEST,
  EXAMPLE_EVALUATE_REQUEST,
  MAX_CANDIDATES_PER_REQUEST,
  MAX_REQUEST_BYTES,
  WIRE_SIGNIFICANT_DIGITS,
} from '@/lib/api';
import { fieldRows, variantRows, type FieldRow } from '@/lib/api/fieldTable';
import { CautionNotice } from '@/components/shell/CautionNotice';
import { can } from '@/lib/auth/permissions';
import { requirePageUser } from '@/server/auth/session';

export const metadata = { title: 'Calculation API' };
export const dynamic = 'force-dynamic';

const ENDPOINTS = [
  { method: 'POST', path: '/api/v1/evaluate', scope: 'calc', what: `Evaluate up to ${MAX_CANDIDATES_PER_REQUEST} candidates at the design current and compare them.` },
  { method: 'POST', path: '/api/v1/ampacity', scope: 'calc', what: 'Ampacity of one candidate, with the heat-balance profile at that current.' },
  { method: 'GET', path: '/api/v1/flags', scope: 'read', what: 'Every assumption flag a calculation may raise, with its severity.' },
  { method: 'GET', path: '/api/v1/openapi.json', scope: 'none', what: 'The OpenAPI 3.1 description, for client generators.' },
];

const ERRORS = [
  { status: '400', code: 'invalid_input, invalid_json', when: 'A field is missing, out of range or unknown, or the body is not JSON. fieldPath and issues name every field at fault.' },
  { status: '401', code: 'unauthenticated, token_revoked, token_expired', when: 'No token, or one that is unknown, revoked or expired.' },
  { status: '403', code: 'forbidden', when: 'The token lacks the scope of the endpoint.' },
  { status: '413', code: 'payload_too_large', when: `The body is larger than ${MAX_REQUEST_BYTES / 1024} KiB.` },
  { status: '415', code: 'unsupported_media_type', when: 'The body is not sent as application/json.' },
  { status: '422', code: 'solver codes, no_finite_result', when: 'The inputs are valid but no honest answer exists (for example no steady state at any current).' },
  { status: '429', code: 'rate_limited', when: 'The token used its requests for this minute; Retry-After says how many seconds to wait.' },
  { status: '503', code: 'database_unavailable', when: 'Ampwarden cannot reach its database (tokens are checked there); try again shortly.' },
];

function FieldTable({ caption, rows }: { caption: string; rows: FieldRow[] }) {
  return (
    <div className="mt-3 overflow-x-auto">
      <table className="w-full text-left text-body">
        <caption className="pb-1 text-left font-semibold text-ink-800">{caption}</caption>
        <thead className="border-b border-ink-200 text-ink-700">
          <tr>
            <th scope="col" className="py-1.5 pr-3">Field</th>
            <th scope="col" className="py-1.5 pr-3">Type</th>
            <th scope="col" className="py-1.5 pr-3">Allowed</th>
            <th scope="col" className="py-1.5 pr-3">Required</th>
            <th scope="col" className="py-1.5">Meaning</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.path} className="border-b border-ink-100 align-top">
              <td className="num py-1.5 pr-3">{row.path}</td>
              <td className="py-1.5 pr-3">{row.type}</td>
              <td className="num py-1.5 pr-3">{row.allowed}</td>
              <td className="py-1.5 pr-3">{row.required ? 'yes' : 'no'}</td>
              <td className="py-1.5 text-ink-700">{row.description}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Code({ children, label }: { children: string; label: string }) {
  return (
    <pre aria-label={label} tabIndex={0} className="num mt-2 max-h-96 overflow-auto rounded-md bg-ink-900 p-3 text-caption text-paper">
      {children}
    </pre>
  );
}

export default async function ApiDocsPage() {
  const user = await requirePageUser();
  // The answer excerpt is computed here, by the same library the API uses, so it is never stale.
  const sample = compareCandidates(EXAMPLE_EVALUATE_REQUEST.candidates, EXAMPLE_EVALUATE_REQUEST.conditions);
  const excerpt = {
    apiVersion: 'v1',
    caution: API_CAUTION,
    evaluations: sample.evaluations.map((evaluation) =>
      evaluation.ok
        ? {
            ok: true,
            id: evaluation.id,
            passes: evaluation.passes,
            hotSpotC: evaluation.hotSpotC === null ? null : Number(evaluation.hotSpotC.toFixed(2)),
            limit: evaluation.limit,
            marginK: evaluation.marginK === null ? null : Number(evaluation.marginK.toFixed(2)),
            ampacityA: Number(evaluation.ampacityA.toFixed(1)),
            flags: evaluation.flags.map((flag) => ({ code: flag.code, severity: flag.severity })),
            '…': 'losses, voltage drop, short circuit, profile, costs',
          }
        : evaluation,
    ),
    smallestPassingIndex: sample.smallestPassingIndex,
    lowestLifeCycleCostPassingIndex: sample.lowestLifeCycleCostPassingIndex,
  };
  const curl = [
    'curl -sS https://<your Ampwarden>/api/v1/evaluate \\',
    '  -H "Authorization: Bearer $AMPWARDEN_TOKEN" \\',
    '  -H "Content-Type: application/json" \\',
    '  --data @circuit.json',
  ].join('\n');
  const errorExample = {
    error: {
      code: 'invalid_input',
      message: 'candidates.1.layers.0.thicknessM: Layer thickness must be greater than 0 m',
      issues: [{ path: 'candidates.1.layers.0.thicknessM', message: 'Layer thickness must be greater than 0 m' }],
    },
  };

  return (
    <article aria-labelledby="api-heading" className="max-w-5xl space-y-8">
      <header>
        <h1 id="api-heading" className="text-title">
          Calculation API
        </h1>
        <p className="mt-2 text-lead text-ink-700">
          Size bus bars and cables from your own tools — a drawing program, a cable schedule script, a spreadsheet macro — with the same heat-balance
          solver, checks and assumption flags as the sizing sheet.
        </p>
        <div className="mt-4">
          <CautionNotice />
        </div>
      </header>

      <section aria-labelledby="api-access">
        <h2 id="api-access" className="text-lead font-semibold">
          Access
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          <li>
            Every call carries a team API token: <code className="num">Authorization: Bearer awt_…</code>. Admins create and revoke tokens under{' '}
            {can(user.role, 'apitoken:manage') ? (
              <Link href="/admin/tokens" className="text-copper-700 underline">
                Admin → API tokens
              </Link>
            ) : (
              <span>Admin → API tokens (ask an admin of your team)</span>
            )}
            ; a token is shown once, when it is made, and Ampwarden keeps only its fingerprint.
          </li>
          <li>
            Scopes: <span className="num">calc</span> runs calculations, <span className="num">read</span> reads reference data. A token without the
            scope an endpoint needs is refused with 403.
          </li>
          <li>Your browser session does not open the API: programs use tokens, people use the pages.</li>
          <li>
            Each token has its own rate (default {DEFAULT_REQUESTS_PER_MINUTE} requests a minute); answers carry <span className="num">X-RateLimit-Limit</span>,{' '}
            <span className="num">X-RateLimit-Remaining</span> and <span className="num">X-RateLimit-Reset</span>.
          </li>
          <li>
            Bodies are JSON, at most {MAX_REQUEST_BYTES / 1024} KiB, at most {MAX_CANDIDATES_PER_REQUEST} candidates per evaluation.
          </li>
          <li>
            Quantities are SI, and each field name ends in its unit: <span className="num">designCurrentA</span>,{' '}
            <span className="num">thicknessM</span>, <span className="num">r20OhmPerM</span>, <span className="num">continuousLimitC</span>. Convert at
            your end.
          </li>
        </ul>
      </section>

      <section aria-labelledby="api-endpoints">
        <h2 id="api-endpoints" className="text-lead font-semibold">
          Endpoints
        </h2>
        <table className="mt-2 w-full text-left text-body">
          <caption className="sr-only">Endpoints of the calculation API</caption>
          <thead className="border-b border-ink-200 text-ink-700">
            <tr>
              <th scope="col" className="py-1.5 pr-3">Method</th>
              <th scope="col" className="py-1.5 pr-3">Path</th>
              <th scope="col" className="py-1.5 pr-3">Scope</th>
              <th scope="col" className="py-1.5">What it does</th>
            </tr>
          </thead>
          <tbody>
            {ENDPOINTS.map((endpoint) => (
              <tr key={endpoint.path} className="border-b border-ink-100">
                <td className="num py-1.5 pr-3">{endpoint.method}</td>
                <td className="num py-1.5 pr-3">{endpoint.path}</td>
                <td className="num py-1.5 pr-3">{endpoint.scope}</td>
                <td className="py-1.5">{endpoint.what}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2">
          The machine-readable description is at{' '}
          <a href="/api/v1/openapi.json" className="num text-copper-700 underline">
            /api/v1/openapi.json
          </a>{' '}
          (OpenAPI 3.1, generated from the same schemas that check each request).
        </p>
      </section>

      <section aria-labelledby="api-example">
        <h2 id="api-example" className="text-lead font-semibold">
          An evaluation, end to end
        </h2>
        <p className="mt-2">Two single-core copper XLPE cables compared for a 250 A feeder in free air (an invented circuit):</p>
        <Code label="Calling the evaluate endpoint with curl">{curl}</Code>
        <Code label="Example body: circuit.json">{JSON.stringify(EXAMPLE_EVALUATE_REQUEST, null, 2)}</Code>
        <p className="mt-3">The answer (shortened here; the real one carries every field listed in the OpenAPI description):</p>
        <Code label="Example answer, shortened">{JSON.stringify(excerpt, null, 2)}</Code>
        <p className="mt-3">
          Read <span className="num">passes</span> together with the flags: a <span className="num">blocker</span> fails the candidate, a{' '}
          <span className="num">review</span> flag is a statement a licensed reviewer must accept before the sizing is used, a{' '}
          <span className="num">note</span> is shown for the record. Inputs you leave out are assumed — and flagged — never silently filled in.
          Every number in an answer carries {WIRE_SIGNIFICANT_DIGITS} significant digits, far more than any input or method supports.
        </p>
        <p className="mt-3">
          Bars are rated as the system they form when <span className="num">installation.system</span> is given: each bar of a pack with its own share of the current and its own
          heat balance, and — with the supports and a fault — the IEC 60865-1 forces on the bars and supports (<span className="num">forces</span> in the answer). A protective device
          in <span className="num">conditions.protection</span> adds the overload coordination, and with the source impedance and the protective conductor the automatic
          disconnection and the protective conductor’s section (<span className="num">protection</span> in the answer):
        </p>
        <Code label="Example body: a bus-bar system and its breaker">{JSON.stringify(EXAMPLE_BUSBAR_SYSTEM_REQUEST, null, 2)}</Code>
        <p className="mt-3">For the ampacity of one conductor, send one candidate; the design current may be left out:</p>
        <Code label="Example body for the ampacity endpoint">{JSON.stringify(EXAMPLE_AMPACITY_REQUEST, null, 2)}</Code>
      </section>

      <section aria-labelledby="api-fields">
        <h2 id="api-fields" className="text-lead font-semibold">
          Fields
        </h2>
        <p className="mt-2">Unknown fields are refused (a misspelt optional field would otherwise be ignored and a default assumed).</p>
        <FieldTable caption="conditions" rows={fieldRows('Conditions', 'conditions')} />
        {variantRows('Installation', 'conditions.installation').map((variant) => (
          <FieldTable key={variant.kind} caption={`conditions.installation, kind "${variant.kind}"`} rows={variant.rows} />
        ))}
        {variantRows('ProtectiveDevice', 'conditions.protection.device').map((variant) => (
          <FieldTable key={variant.kind} caption={`conditions.protection.device, kind "${variant.kind}"`} rows={variant.rows} />
        ))}
        <FieldTable caption='candidates[] of kind "cable"' rows={fieldRows('CableCandidate', 'candidates[]')} />
        <FieldTable caption='candidates[] of kind "bar"' rows={fieldRows('BarCandidate', 'candidates[]')} />
      </section>

      <section aria-labelledby="api-errors">
        <h2 id="api-errors" className="text-lead font-semibold">
          Errors
        </h2>
        <p className="mt-2">Every error is JSON with a stable code, a plain message and, for input errors, the path of each field at fault:</p>
        <Code label="Example error">{JSON.stringify(errorExample, null, 2)}</Code>
        <table className="mt-3 w-full text-left text-body">
          <caption className="sr-only">Error answers</caption>
          <thead className="border-b border-ink-200 text-ink-700">
            <tr>
              <th scope="col" className="py-1.5 pr-3">Status</th>
              <th scope="col" className="py-1.5 pr-3">Code</th>
              <th scope="col" className="py-1.5">When</th>
            </tr>
          </thead>
          <tbody>
            {ERRORS.map((row) => (
              <tr key={row.status} className="border-b border-ink-100 align-top">
                <td className="num py-1.5 pr-3">{row.status}</td>
                <td className="num py-1.5 pr-3">{row.code}</td>
                <td className="py-1.5">{row.when}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </article>
  );
}
