// Issue 22, "a document a licensed engineer can sign": the PDF of a sheet is a calculation
// package. A bus-bar sheet with the checks over time and along the run is submitted by its
// designer, every review flag acknowledged and the sheet approved by a reviewer whose profile
// holds a licence number and jurisdiction; a second revision is started and saved with a new
// design current. The text of both PDFs (unpdf) must carry: the document number, the revision
// table (what changed, who edited, submitted, reviewed), the approver's name, licence and
// jurisdiction with the approval statement (or "Not approved" on the draft), the signature and
// stamp area, pages numbered "Page n of N", the table headers repeated on the pages a long table
// runs onto, and the plots: hot spot against current, over time, along the run; for a buried
// cable the profile with the soil and the cross-section drawing; across a bus-bar pack.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { calculationPackageOf } from '@/db/queries/calculationPackage';
import { setProfessionalProfile } from '@/db/queries/profile';
import { createProject } from '@/db/queries/projects';
import { acknowledgeFlag, createSheet, getSheet, reviseSheet, saveSheet, transitionSheet, type SheetRecord } from '@/db/queries/sheets';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { documentNumberOf } from '@/lib/sheet/records';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf } from './shareFixtures';

afterAll(() => closeDb());

async function pagesOf(pdf: Buffer): Promise<string[]> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: false });
  return (text as string[]).map((page) => page.normalize('NFKC').replace(/\s+/g, ' '));
}
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');

function barInputs(): SheetInputs {
  const bar = testCopperBar(100, 10);
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1200, lengthM: 12 };
  i.environment = { ...i.environment, ambientC: 35 };
  i.fault = { checked: true, currentA: 20000, durationS: 0.5 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.overTime = { checked: true, overloadCurrentA: 1400, overloadDurationS: 600, dailyProfileA: Array.from({ length: 24 }, (_, h) => (h >= 9 && h < 17 ? 1250 : 700)), faultWithCoverings: false };
  i.alongRun = { checked: true, lengthM: 8, startEnd: 'terminal', startTemperatureC: 70, endEnd: 'terminal', endTemperatureC: 65, joints: [{ positionM: 4, resistanceMicroOhm: 10 }] };
  return i;
}

function buriedInputs(): SheetInputs {
  const i = defaultSheetInputs('buried');
  i.circuit = { ...i.circuit, designCurrentA: 300, lengthM: 90 };
  i.installation = { ...i.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 15 };
  // Twenty candidates: the candidates table runs over a page, so its header must repeat.
  i.candidates = Array.from({ length: 20 }, (_, k) => ({ ...testCable240, id: `cu-xlpe-240-${k}`, label: `240 mm² Cu XLPE run ${k + 1} (test)` }));
  i.chosenCandidateId = i.candidates[0].id;
  return i;
}

function packInputs(): SheetInputs {
  const pack = testCopperBar(100, 10, { barsPerPhase: 3, emissivity: 0.9 });
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 2000, lengthM: 10 };
  i.candidates = [pack];
  i.chosenCandidateId = pack.id;
  i.busbarSystem = { ...i.busbarSystem, phaseSpacingM: 0.2 };
  return i;
}

const LICENCE = { licenceNumber: 'PE-40417 (test)', licenceJurisdiction: 'Invented Province Board of Engineers' };
let designer: { id: string; role: 'designer'; name: string };
let reviewer: { id: string; role: 'reviewer'; name: string };
let teamId: string;
let approved: SheetRecord;
let draft: SheetRecord;
let buried: SheetRecord;
let pack: SheetRecord;

const withPackage = async (sheet: SheetRecord) => ({ ...sheet, calculationPackage: await calculationPackageOf(teamId, sheet) });

beforeAll(async () => {
  const team = await createTestTeam('package-pdf');
  teamId = team.id;
  designer = (await createTestUser(team.id, 'designer', { name: 'Ines Marlow (test designer)' })) as typeof designer;
  reviewer = (await createTestUser(team.id, 'reviewer', { name: 'Rhea Tamsin (test reviewer)' })) as typeof reviewer;
  await setProfessionalProfile(team.id, reviewer.id, LICENCE);
  const project = await createProject(team.id, designer.id, { name: 'Package PDF project (test)', site: 'Invented site' });
  const make = async (tag: string, inputs: SheetInputs) =>
    (await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} feeder`, inputs })).id;

  const first = await make('PKG', barInputs());
  await transitionSheet(team.id, actorOf(designer), first, 'submit');
  const submitted = (await getSheet(team.id, first))!;
  expect(submitted.result!.chosenFlags.filter((f) => f.severity === 'blocker')).toEqual([]);
  for (const f of submitted.result!.chosenFlags.filter((x) => x.severity === 'review')) await acknowledgeFlag(team.id, actorOf(reviewer), first, f.code, 'Accepted for this site (test).');
  await transitionSheet(team.id, actorOf(reviewer), first, 'approve');
  approved = (await getSheet(team.id, first))!;
  const second = await reviseSheet(team.id, actorOf(designer), first);
  const opened = (await getSheet(team.id, second.id))!;
  await saveSheet(team.id, actorOf(designer), second.id, { expectedVersion: opened.version, inputs: { ...opened.inputs, circuit: { ...opened.inputs.circuit, designCurrentA: 1100 } } });
  draft = (await getSheet(team.id, second.id))!;
  buried = (await getSheet(team.id, await make('SOIL', buriedInputs())))!;
  pack = (await getSheet(team.id, await make('PACK', packInputs())))!;
}, 240_000);

describe('PDF: the calculation package a licensed engineer signs', () => {
  it('the approved revision: document number, revision table, approver with licence and jurisdiction, statement, signature and stamp, pages n of N', async () => {
    const pages = await pagesOf(await renderSheetPdf(await withPackage(approved), new Date('2026-01-05T00:00:00Z')));
    const all = pages.join(' ');
    const number = documentNumberOf(approved.id);
    expect(number).toMatch(/^AW-[0-9A-F]{8}$/);
    // The title block's labels are printed as written (never upper-cased: units inside labels must keep their case).
    expect(all).toContain(`Document number ${number}`);
    for (const page of pages) expect(page).toContain(number);
    expect(all).toContain('Revisions Rev. Status What changed Edited by Submitted by Reviewed by Decision');
    expect(all).toContain(fold(`1 Approved First issue ${designer.name} ${designer.name} ${reviewer.name} Approved`));
    expect(all).toContain('I have checked this calculation package');
    expect(all).toContain(fold(`Approved by ${reviewer.name}, licence or registration ${LICENCE.licenceNumber} (${LICENCE.licenceJurisdiction}), on`));
    for (const box of ['Signature', 'Date', 'Professional stamp or seal', `Licence or registration number: ${LICENCE.licenceNumber}`, `Jurisdiction: ${LICENCE.licenceJurisdiction}`]) expect(all).toContain(fold(box));
    expect(all).not.toContain('Do not sign');
    pages.forEach((page, n) => expect(page).toContain(`Page ${n + 1} of ${pages.length}`));
    // The plots of a single bar: hot spot against current, over time and along the run (its thickness profile is flat).
    for (const plot of ['Plot: Hot spot against current', 'Plot: Hot spot during the overload of 1400 A', 'Plot: Hot spot over the daily load cycle', 'Plot: Temperature along the run between the terminals']) expect(all).toContain(plot);
    expect(all).toContain('position along the run (m)');
    expect(all).toContain('joint 1');
    expect(all).not.toContain('Plot: heat-balance profile');
  });

  it('the next revision in draft: both revisions with what changed and who edited, and no approval to sign', async () => {
    const pages = await pagesOf(await renderSheetPdf(await withPackage(draft), new Date('2026-01-06T00:00:00Z')));
    const all = pages.join(' ');
    expect(draft.revision).toBe(2);
    // Revisions of one sheet share the document number of the first.
    expect(all).toContain(documentNumberOf(approved.id));
    expect(all).toContain(fold(`1 Approved First issue ${designer.name} ${designer.name} ${reviewer.name} Approved`));
    expect(all).toContain(fold(`2 Draft circuit ${designer.name} — — not decided`));
    expect(all).toContain(`Not approved. This calculation package ${documentNumberOf(approved.id)}, revision 2 is draft`);
    expect(all).toContain('Do not sign: this revision is not approved.');
    expect(all).not.toContain('I have checked this calculation package');
  });

  it('a buried cable: the profile with its layers and the soil to the ground, the cross-section drawing, and the table header on every page the table runs onto', async () => {
    const pages = await pagesOf(await renderSheetPdf(await withPackage(buried), new Date('2026-01-07T00:00:00Z')));
    const all = pages.join(' ');
    expect(all).toContain('Plot: heat-balance profile at 300 A, through the conductor and its layers, with the soil to the ground');
    for (const words of ['XLPE insulation', 'PVC sheath', 'soil (not to scale)', 'ground 15 °C', 'radius from the conductor axis (mm)', 'Plot: Hot spot against current', 'ground surface']) expect(all).toContain(fold(words));
    const header = fold('Candidate Section/phase (mm²) Hot spot (°C) Limit (°C)');
    // Pages with rows of the candidates table (a candidate's label followed by its section).
    const runsOnto = pages.filter((p) => /Cu XLPE run \d+ \(test\) 240 /.test(p));
    expect(runsOnto.length).toBeGreaterThan(1);
    for (const page of runsOnto) expect(page).toContain(header);
  });

  it('a bus-bar pack: each bar’s temperature across the packs instead of the flat profile through the thickness', async () => {
    const all = (await pagesOf(await renderSheetPdf(await withPackage(pack), new Date('2026-01-08T00:00:00Z')))).join(' ');
    expect(pack.result?.plots?.map((p) => p.id)).toEqual(['hot-spot-vs-current', 'across-pack']);
    expect(all).toContain('Plot: Temperature of each bar across the packs');
    expect(all).toContain('bar, counted across the phases');
    expect(all).not.toContain('Plot: heat-balance profile');
  });
});
