// The PDF of a saved sheet with the optional check "Inside the enclosure" (physics.md §6): a copper
// bar sheet in a closed enclosure. The PDF text (unpdf) must carry the figures the library computes
// for the same saved inputs (lib/sheet/enclosureAir.ts computeEnclosureAir, run here in the test),
// the method named, every flag in full, and the caution on the page that shows them; the same sheet
// with the check off has no such section.
import { flagLine, flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, type SheetRecord } from '@/db/queries/sheets';
import { CAUTION_TEXT } from '@/lib/caution';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { computeEnclosureAir } from '@/lib/sheet/enclosureAir';
import { formatNumber } from '@/lib/units';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf } from './shareFixtures';

afterAll(() => closeDb());

const HEADING = 'Inside the enclosure (chosen candidate)';

const bar = testCopperBar(60, 10);

function inputs(checked: boolean): SheetInputs {
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1200, lengthM: 10 };
  i.environment = { ...i.environment, ambientC: 40 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.enclosureAir = { ...i.enclosureAir, checked, otherLossesW: 600, routeLengthInsideM: 2, outsideAirC: 35, backCovered: true, sidesCovered: 1 };
  return i;
}

async function pagesOf(pdf: Buffer): Promise<string[]> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: false });
  return (text as string[]).map((page) => page.normalize('NFKC').replace(/\s+/g, ' '));
}
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');
const c = (v: number) => `${formatNumber(v, 4)} °C`;

let withCheck: SheetRecord;
let withoutCheck: SheetRecord;

beforeAll(async () => {
  const team = await createTestTeam('enclosure-pdf');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const project = await createProject(team.id, designer.id, { name: 'Enclosure PDF project (test)', site: 'Invented site' });
  const save = async (tag: string, i: SheetInputs) => {
    const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} panel board`, inputs: i });
    return (await getSheet(team.id, created.id))!;
  };
  withCheck = await save('ENCL', inputs(true));
  withoutCheck = await save('OPEN', inputs(false));
});

describe('PDF: "Inside the enclosure"', () => {
  it('prints the losses, the air inside and the hot spot the library computes, the method, every flag and the caution', async () => {
    expect(withCheck.inputs.enclosureAir.checked).toBe(true);
    const outcome = computeEnclosureAir(withCheck.inputs, bar.id);
    if (!outcome?.ok) throw new Error(`the check must compute for this sheet: ${JSON.stringify(outcome)}`);
    const r = outcome.result;
    const pages = await pagesOf(await renderSheetPdf(withCheck, new Date('2026-01-01T00:00:00Z')));
    const all = pages.join(' ');
    expect(all).toContain(HEADING);
    expect(all).toContain(
      fold(
        `Losses inside ${formatNumber(r.totalLossesW, 4)} W (circuit ${formatNumber(r.conductorLossesW, 4)} W, other equipment ${formatNumber(r.otherLossesW, 4)} W) over A_e = ${formatNumber(r.effectiveAreaM2, 4)} m²: mean air inside ${c(r.insideAirC)} (sheet ambient ${c(r.sheetAmbientC)}).`,
      ),
    );
    expect(all).toContain(fold(`Hot spot in that air ${r.hotSpotC === null ? 'none (no steady state)' : c(r.hotSpotC)} against ${c(r.limitC)} — ${r.passes ? 'passes' : 'FAILS'}.`));
    expect(all).toContain('IEC TR 60890 surface factors');
    // 600 W of other equipment in a 2.0 × 0.8 × 0.6 m box heats its air well above the 40 °C the sheet sized with.
    const codes = r.flags.map((f) => f.code);
    expect(codes).toContain('ENCLOSURE_AIR_ESTIMATED');
    expect(codes).toContain('ENCLOSURE_AIR_ABOVE_AMBIENT');
    for (const flag of r.flags) expect(all).toContain(fold(`Flag: ${flagLine(flag)}`));
    const showing = pages.filter((p) => p.includes(HEADING));
    expect(showing.length).toBeGreaterThan(0);
    for (const page of showing) for (const line of CAUTION_TEXT) expect(page).toContain(line);
  });

  it('a sheet saved with the check off has no such section', async () => {
    expect(computeEnclosureAir(withoutCheck.inputs, bar.id)).toBeNull();
    const all = (await pagesOf(await renderSheetPdf(withoutCheck, new Date('2026-01-01T00:00:00Z')))).join(' ');
    expect(all).toContain(withoutCheck.circuitTag);
    expect(all).not.toContain(HEADING);
    expect(all).not.toContain(flagTitle('ENCLOSURE_AIR_ESTIMATED'));
  });
});
