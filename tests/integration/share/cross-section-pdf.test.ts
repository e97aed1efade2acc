// The PDF of a saved buried sheet with "Solve the cross-section" on (issue 20): the save computes the
// chosen candidate's field on the server and stores it with the snapshot (db/queries/sheets →
// lib/sheet/snapshot.ts); the PDF text (unpdf) must carry the field's figures — every cable's
// temperature by the field and by the IEC rating, the governing cable, the ampacity by the field
// against the rating's, the mesh — as lib/sheet/crossSectionField.ts computes them for the same saved
// inputs (run here in the test), with the caution; the same sheet saved with the option off has no
// such section. A stored snapshot written before the option (no `crossSection`) still renders.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, type SheetRecord } from '@/db/queries/sheets';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { FIELD_CAUTION, fieldCableRows, fieldReportSentences, savedFieldCheck } from '@/lib/sheet/crossSectionField';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCable240 } from '../../helpers/sheetCandidates';
import { actorOf } from './shareFixtures';

afterAll(() => closeDb());

const HEADING = 'Cross-section in two dimensions';

function inputs(checked: boolean): SheetInputs {
  const i = defaultSheetInputs('buried');
  i.circuit = { ...i.circuit, designCurrentA: 300, lengthM: 90 };
  i.installation = {
    ...i.installation,
    depthM: 0.8,
    soilResistivityKmPerW: 1.2,
    groundC: 20,
    circuitSpacingM: 0.3,
    otherCircuits: [{ label: 'Pump house', currentA: 250, sameCable: true, externalDiameterM: null, lossWPerM: null }],
  };
  i.candidates = [testCable240];
  i.chosenCandidateId = testCable240.id;
  i.crossSection = { checked, surface: 'convective', heatTransferCoefficientWPerM2K: 12 };
  return i;
}

async function textOf(pdf: Buffer): Promise<string> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
  return (text as string).normalize('NFKC').replace(/\s+/g, ' ');
}
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');

let withField: SheetRecord;
let withoutField: SheetRecord;

beforeAll(async () => {
  const team = await createTestTeam('field-pdf');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const project = await createProject(team.id, designer.id, { name: 'Field PDF project (test)', site: 'Invented site' });
  const save = async (tag: string, i: SheetInputs) => {
    const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} buried feeder`, inputs: i });
    return (await getSheet(team.id, created.id))!;
  };
  withField = await save('FIELD', inputs(true));
  withoutField = await save('NOFIELD', inputs(false));
});

describe('PDF: the cross-section solved in two dimensions', () => {
  it('the save stored the field of the chosen candidate, on the coarser mesh it names', () => {
    const part = withField.result?.crossSection;
    if (!part?.ok) throw new Error(`the saved snapshot must carry the field: ${JSON.stringify(part)}`);
    expect(part.report.candidateId).toBe(testCable240.id);
    expect(part.report.mesh.name).toBe('saved');
    expect(part.report.surface).toEqual({ kind: 'convective', temperatureC: 20, heatTransferCoefficientWPerM2K: 12 });
    expect(withoutField.result?.crossSection).toBeUndefined();
  });

  it('prints every cable’s temperature by the field and by the IEC rating, the governing cable, both ampacities, the mesh and the caution', async () => {
    const outcome = savedFieldCheck(withField.inputs);
    if (!outcome?.ok) throw new Error('the field must compute for this sheet');
    const report = outcome.report;
    const all = await textOf(await renderSheetPdf(withField, new Date('2026-01-01T00:00:00Z')));
    expect(all).toContain(fold(`${HEADING}: ${report.candidateLabel}`));
    const words = fieldReportSentences(report);
    for (const line of words.results) expect(all).toContain(fold(line));
    expect(all).toContain(fold(words.method));
    for (const row of fieldCableRows(report, ['Pump house'])) {
      expect(all).toContain(fold(`${row.governs ? '[governs] ' : ''}${row.cable}`));
      expect(all).toContain(fold(`${row.field} ${row.iec} ${row.difference} ${row.surface}`));
    }
    expect(report.ampacity.fieldA).not.toBeNull();
    expect(all).toContain(fold(`Caution. ${FIELD_CAUTION}`));
  });

  it('a sheet saved with the option off, or a snapshot from before the option, prints no such section', async () => {
    const off = await textOf(await renderSheetPdf(withoutField, new Date('2026-01-01T00:00:00Z')));
    expect(off).toContain(withoutField.circuitTag);
    expect(off).not.toContain(HEADING);
    const { crossSection: _part, ...older } = withField.result!;
    const olderPdf = await textOf(await renderSheetPdf({ ...withField, result: older }, new Date('2026-01-01T00:00:00Z')));
    expect(olderPdf).toContain(withField.circuitTag);
    expect(olderPdf).not.toContain(HEADING);
  });
});
