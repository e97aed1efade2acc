/**
 * A sheet to share: 400 A on copper single-core cables in air (the invented demo cables of
 * db/seed/sheets.ts, data marked from memory there), 240 mm² XLPE chosen and 50 mm² PVC compared.
 * The 240 mm² result carries review and note flags (ambient assumed, data from memory…), so the
 * documents have flags to show.
 */
import { createProject } from '@/db/queries/projects';
import { createSheet } from '@/db/queries/sheets';
import { demoSingleCore } from '@/db/seed/sheets';
import { defaultSheetInputs, type Actor, type SheetInputs } from '@/lib/sheet';
import { can, type Role } from '@/lib/auth/permissions';

export const actorOf = (user: { id: string; role: Role }): Actor => ({ userId: user.id, can: (p) => can(user.role, p) });

export const cable240 = demoSingleCore({ id: 'cu-xlpe-240', material: 'copper', sectionMm2: 240, r20OhmPerKm: 0.0754, conductorDiameterMm: 18.0, insulation: 'XLPE', insulationMm: 1.7, sheathMm: 1.9, parallel: 1, pricePerM: '25.00' });
export const cable50 = demoSingleCore({ id: 'cu-pvc-50', material: 'copper', sectionMm2: 50, r20OhmPerKm: 0.387, conductorDiameterMm: 8.2, insulation: 'PVC', insulationMm: 1.4, sheathMm: 1.6, parallel: 1, pricePerM: '9.80' });

export function shareInputs(): SheetInputs {
  const inputs = defaultSheetInputs('cable-in-air');
  inputs.candidates = [cable240, cable50];
  inputs.chosenCandidateId = cable240.id;
  inputs.notes = 'Switchroom to the test chiller (invented for tests).';
  return inputs;
}

/** A project and a draft sheet of the team, authored by `author`; names carry `label` so tests can look for them. */
export async function makeSharedSheet(teamId: string, author: { id: string; role: Role }, label: string) {
  const project = await createProject(teamId, author.id, { name: `${label} project (test)`, site: 'Invented site' });
  const circuitTag = `${label}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase();
  const title = `${label} chiller feeder`;
  const sheet = await createSheet(teamId, actorOf(author), { projectId: project.id, circuitTag, title, inputs: shareInputs() });
  return { projectId: project.id, projectName: `${label} project (test)`, sheetId: sheet.id, circuitTag, title };
}
