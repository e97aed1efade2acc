// The PDF of a saved sheet with a bus-bar pack, its system and a protective device (issues 18 and
// 21): the text (unpdf) must carry the figures the library computes for the same saved inputs
// (lib/sheet/compute, run here in the test) in the words of lib/sheet/systemWords — every bar of the
// pack with its temperature and share, the governing bar, the IEC 60865-1 lines with κ by hand
// (κ = 1.02 + 0.98·e^(−3·0.1) = 1.746, IEC 60909-0 eq. 55), the protection verdicts — and the flags
// of each check beside it; a cable sheet without a device prints neither section.
import { flagTitle } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, type SheetRecord } from '@/db/queries/sheets';
import type { CandidateEvaluationOk } from '@/lib/electrical/sizing/types';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { computeSheet } from '@/lib/sheet/compute';
import { deviceWords, forcesLines, hottestBarText, packBarRows } from '@/lib/sheet/systemWords';
import { formatNumber } from '@/lib/units';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf } from './shareFixtures';

afterAll(() => closeDb());

const pack = testCopperBar(100, 10, { barsPerPhase: 3, emissivity: 0.9 });

function packInputs(): SheetInputs {
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 2000, lengthM: 10 };
  i.environment = { ...i.environment, ambientC: 35 };
  i.fault = { checked: true, currentA: 40_000, durationS: 0.5 };
  i.candidates = [pack];
  i.chosenCandidateId = pack.id;
  i.busbarSystem = { ...i.busbarSystem, phaseSpacingM: 0.2, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', supportStrengthN: 25_000, peakFactorBy: 'r-over-x', rOverX: 0.1 };
  i.protection = { ...i.protection, included: true, device: { ...i.protection.device, kind: 'breaker-iec60947-2', ratedCurrentA: 2500, settingCurrentA: 2000, instantaneousCurrentA: 20_000 } };
  return i;
}

async function textOf(pdf: Buffer): Promise<string> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
  return (text as string).normalize('NFKC').replace(/\s+/g, ' ');
}
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');

let packSheet: SheetRecord;
let cableSheet: SheetRecord;

beforeAll(async () => {
  const team = await createTestTeam('systems-pdf');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const project = await createProject(team.id, designer.id, { name: 'Bus-bar PDF project (test)', site: 'Invented site' });
  const save = async (tag: string, i: SheetInputs) => {
    const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} run`, inputs: i });
    return (await getSheet(team.id, created.id))!;
  };
  packSheet = await save('PACK', packInputs());
  const cable = defaultSheetInputs('cable-in-air');
  cable.candidates = [testCable240];
  cable.chosenCandidateId = testCable240.id;
  cableSheet = await save('CABLE', cable);
});

describe('PDF: the bus-bar system and the protection', () => {
  it('prints every bar, the governing bar, the forces and the protection verdicts the library computes, with their flags', async () => {
    const computed = computeSheet(packSheet.inputs);
    if (!computed.ok || !computed.comparison.evaluations[0].ok) throw new Error('must compute');
    const e: CandidateEvaluationOk = computed.comparison.evaluations[0];
    const text = await textOf(await renderSheetPdf(packSheet));
    expect(text).toContain(fold(`Bus-bar system rated: ${pack.label}`));
    expect(text).toContain(fold(`Governs: ${hottestBarText(e.pack!)}`));
    for (const row of packBarRows(e.pack!)) {
      expect(text).toContain(fold(`${row.phase}, ${row.bar}`));
      expect(text).toContain(formatNumber(row.temperatureC, 4));
    }
    expect(text).toContain('Forces under short circuit (IEC 60865-1)');
    expect(e.forces!.kappa).toBeCloseTo(1.02 + 0.98 * Math.exp(-0.3), 9);
    for (const line of forcesLines(e.forces!, 0.5)) expect(text).toContain(fold(line.value));
    expect(text).toContain(fold(`Protection: ${deviceWords(packSheet.inputs.protection.device)}`));
    expect(text).toContain(`Overload coordination: ${e.protection!.coordination!.verdict === 'pass' ? 'passes' : 'fails'}`);
    expect(text).toContain(`Flag: ${flagTitle('DISCONNECTION_NOT_CHECKED')} (for review)`);
    expect(text).toContain(`Flag: ${flagTitle('PACK_RATED_AS_SYSTEM')} (note)`);
    expect(text).toContain(`Flag: ${flagTitle('BUSBAR_DYNAMIC_FACTORS_DEFAULTED')} (for review)`);
    // The printed inputs carry the system as entered (SI, mm).
    expect(text).toContain('Phase spacing (centre to centre) 200 mm');
  });

  it('a cable sheet without a device prints neither section', async () => {
    const text = await textOf(await renderSheetPdf(cableSheet));
    expect(text).not.toContain('Bus-bar system rated');
    expect(text).not.toContain('Forces under short circuit');
    expect(text).not.toContain('Overload coordination:');
    expect(text).toContain('Protective device not described (not checked)');
  });
});
