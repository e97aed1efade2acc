// Issue 22, "plain words instead of internal codes", in the PDF sizing sheet: sheets that raise
// flags in every section that prints them (the steady result, the checks over time and along the
// run, the enclosure air, the bus-bar system and protection, the cross-section in two dimensions,
// data from memory with an acknowledgement) are rendered and their text read back with unpdf. No
// internal code (UPPER_CASE_WITH_UNDERSCORES) and no file of this repository ("physics.md",
// "references.md") may appear; every flag's title does.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, type SheetRecord } from '@/db/queries/sheets';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { flagTitle, INTERNAL_CODE_PATTERN, REPOSITORY_FILE_PATTERN } from '@/lib/sheet/flagWords';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCable240, testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf, shareInputs } from './shareFixtures';

afterAll(() => closeDb());

async function textOf(pdf: Buffer): Promise<string> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
  return (text as string).normalize('NFKC').replace(/\s+/g, ' ');
}
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');

function barWithChecks(): SheetInputs {
  const bar = testCopperBar(100, 10);
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 1800, lengthM: 12 };
  i.fault = { checked: true, currentA: 40000, durationS: 1 };
  i.candidates = [bar];
  i.chosenCandidateId = bar.id;
  i.overTime = { checked: true, overloadCurrentA: 7000, overloadDurationS: 3600, dailyProfileA: Array.from({ length: 24 }, (_, h) => (h >= 9 && h < 17 ? 2300 : 1200)), faultWithCoverings: true };
  i.alongRun = { checked: true, lengthM: 8, startEnd: 'terminal', startTemperatureC: 80, endEnd: 'terminal', endTemperatureC: 70, joints: [{ positionM: 3, resistanceMicroOhm: null }] };
  i.enclosureAir = { ...i.enclosureAir, checked: true, otherLossesW: 600, routeLengthInsideM: 2, outsideAirC: 35, backCovered: true, sidesCovered: 1 };
  return i;
}

function packWithProtection(): SheetInputs {
  const pack = testCopperBar(100, 10, { barsPerPhase: 3, emissivity: 0.9 });
  const i = defaultSheetInputs('bar-on-edge');
  i.circuit = { ...i.circuit, designCurrentA: 2000, lengthM: 10 };
  i.fault = { checked: true, currentA: 40_000, durationS: 0.5 };
  i.candidates = [pack];
  i.chosenCandidateId = pack.id;
  i.busbarSystem = { ...i.busbarSystem, phaseSpacingM: 0.2, supportSpacingM: 0.5, supports: 'continuous-three-or-more-spans', supportStrengthN: 25_000, peakFactorBy: 'r-over-x', rOverX: 0.1 };
  i.protection = { ...i.protection, included: true, device: { ...i.protection.device, kind: 'breaker-iec60947-2', ratedCurrentA: 2500, settingCurrentA: 2000, instantaneousCurrentA: 20_000 } };
  return i;
}

function buriedWithField(): SheetInputs {
  const i = defaultSheetInputs('buried');
  i.circuit = { ...i.circuit, designCurrentA: 300, lengthM: 90 };
  i.installation = { ...i.installation, depthM: 0.8, soilResistivityKmPerW: 1.2, groundC: 20, circuitSpacingM: 0.3, otherCircuits: [{ label: 'Pump house', currentA: 250, sameCable: true, externalDiameterM: null, lossWPerM: null }] };
  i.candidates = [testCable240];
  i.chosenCandidateId = testCable240.id;
  i.crossSection = { checked: true, surface: 'convective', heatTransferCoefficientWPerM2K: 12 };
  return i;
}

const sheets: SheetRecord[] = [];

beforeAll(async () => {
  const team = await createTestTeam('plain-pdf');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const project = await createProject(team.id, designer.id, { name: 'Plain words PDF project (test)', site: 'Invented site' });
  for (const [tag, inputs] of [['RUN', barWithChecks()], ['PACK', packWithProtection()], ['FIELD', buriedWithField()], ['AIR', shareInputs()]] as const) {
    const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} feeder`, inputs });
    sheets.push((await getSheet(team.id, created.id))!);
  }
}, 240_000);

describe('PDF: plain words, never internal codes or repository files', () => {
  it('each sheet raises flags, and its PDF prints every title but no code and no design file', async () => {
    for (const sheet of sheets) {
      const flags = sheet.result?.chosenFlags ?? [];
      expect(flags.length, sheet.circuitTag).toBeGreaterThan(0);
      // One acknowledged review flag shows the reviewer's words with the title, not the code.
      const review = flags.find((f) => f.severity === 'review');
      const acknowledgements = review ? [{ flagCode: review.code, comment: 'Accepted for this site (test).', reviewerName: 'Rhea Tamsin (test reviewer)', createdAt: new Date('2026-01-02T10:00:00Z') }] : [];
      const text = await textOf(await renderSheetPdf({ ...sheet, acknowledgements }, new Date('2026-01-03T00:00:00Z')));
      expect(text).toContain(sheet.circuitTag);
      for (const flag of flags) expect(text, `${sheet.circuitTag}: ${flag.code}`).toContain(fold(flagTitle(flag.code)));
      expect(text.match(INTERNAL_CODE_PATTERN), sheet.circuitTag).toBeNull();
      expect(text.match(REPOSITORY_FILE_PATTERN), sheet.circuitTag).toBeNull();
    }
  }, 240_000);
});
