import { notFound } from 'next/navigation';
import { getSheet, sheetHistory } from '@/db/queries/sheets';
import { getUserPreferences } from '@/db/queries/preferences';
import { saveCandidateGridColumnsAction } from '@/server/auth/preferenceActions';
import { requirePageUser } from '@/server/auth/session';
import { SheetWorkspace, type ClientSheet } from '@/components/sheet/SheetWorkspace';
import type { HistoryItem } from '@/components/sheet/HistoryList';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ sheetId: string }> }) {
  const { sheetId } = await params;
  const user = await requirePageUser('team:read');
  const sheet = await getSheet(user.teamId, sheetId);
  return { title: sheet ? `${sheet.circuitTag} — ${sheet.title}` : 'Sizing sheet' };
}

export default async function SheetPage({ params }: { params: Promise<{ sheetId: string }> }) {
  const { sheetId } = await params;
  const user = await requirePageUser('team:read');
  const sheet = await getSheet(user.teamId, sheetId);
  if (!sheet) notFound();
  const [history, preferences] = await Promise.all([sheetHistory(user.teamId, sheet.id), getUserPreferences(user.teamId, user.id)]);
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
