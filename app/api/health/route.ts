import { NextResponse } from 'next/server';
import { measureDatabaseRoundTrip } from '@/db/queries/health';

export const dynamic = 'force-dynamic';

/** Liveness with a real database round trip: 200 `{ db: "ok" }`, or 503 naming what is down. */
export async function GET() {
  try {
    const { roundTripMs, serverVersion } = await measureDatabaseRoundTrip();
    return NextResponse.json({ status: 'ok', db: 'ok', dbRoundTripMs: Number(roundTripMs.toFixed(2)), postgres: serverVersion });
  } catch (error) {
    return NextResponse.json(
      { status: 'degraded', db: 'down', error: error instanceof Error ? error.message : 'database unreachable' },
      { status: 503 },
    );
  }
}
