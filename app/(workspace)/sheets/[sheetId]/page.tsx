import { cache } from 'react';
import { notFound } from 'next/navigation';
import { getSheet, sheetHistory } from '@/db/queries/sheets';
import { getUserPreferences } from '@/db/queries/preferences';
import { saveCandidateGridColumnsAction } from '@/server/auth/preferenceActions';
import { requirePageUser } from '@/server/auth/session';
import { SheetWorkspace, type ClientSheet } from '@/components/sheet/SheetWorkspace';
import type { HistoryItem } from '@/components/sheet/HistoryList';

export const dynamic = 'force-dynamic';

/** The title and the page read the sheet once per request between them. */
const sheetOfRequest = cache((teamId: string, sheetId: string) => getSheet(teamId, sheetId));

export async function generateMetadata({ params }: { params: Promise<{ sheetId: string }> }) {
  const { sheetId } = await params;
  const user = await requirePageUser('team:read');
  const sheet = await sheetOfRequest(user.teamId, sheetId);
  return { title: sheet ? `${sheet.circuitTag} — ${sheet.title}` : 'Sizing sheet' };
}

export default async function SheetPage({ params }: { params: Promise<{ sheetId: string }> }) {
  const { sheetId } = await params;
  const user = await requirePageUser('team:read');
  // All three reads are scoped to the team, so they can go out together; history of a sheet that
  // is not found is never shown.
  const [sheet, history, preferences] = await Promise.all([
    sheetOfRequest(user.teamId, sheetId),
    sheetHistory(user.teamId, sheetId),
    getUserPreferences(user.teamId, user.id),
  ]);
  if (!sheet) notFound();
  // The client gets the same JSON shape the API answers (dates as ISO strings).
  const initialSheet = JSON.parse(JSON.stringify(sheet)) as ClientSheet;
  const initialHistory = JSON.parse(JSON.stringify(history)) as HistoryItem[];
  return (
    <SheetWorkspace
      key={sheet.id}
      initialSheet={initialSheet}
      initialHistory={initialHistory}
      user={{ id: user.id, role: user.role, unitSystem: user.unitSystem }}
      gridColumns={preferences.candidateGridColumns ?? {}}
      onGridColumnsChange={saveCandidateGridColumnsAction}
    />
  );
}
