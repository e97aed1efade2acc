// The PDF of a saved sheet with the optional checks beyond the steady state (physics.md §6):
// a copper bar-on-edge sheet with "Over time" (overload, daily load, fault with heat into the
// surroundings) and "Along the run" (terminals and two bolted joints, one without a resistance)
// switched on. The PDF text (unpdf) must carry the figures that the library computes for the same
// saved inputs (lib/sheet/beyondSteady.ts computeBeyondSteady, run here in the test), every flag
// of both checks with its code, severity and sentence, and the caution on the pages that show
// them. The same sheet saved with the checks off has no such section.
import { flagLine, flagTitle, SEVERITY_WORDS } from '@/lib/sheet/flagWords';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractText, getDocumentProxy } from 'unpdf';
import { closeDb } from '@/db/client';
import { createProject } from '@/db/queries/projects';
import { createSheet, getSheet, type SheetRecord } from '@/db/queries/sheets';
import { CAUTION_TEXT } from '@/lib/caution';
import { pdfSafeText } from '@/server/pdf/pdfText';
import { defaultSheetInputs, type SheetInputs } from '@/lib/sheet';
import { computeBeyondSteady } from '@/lib/sheet/beyondSteady';
import { formatNumber } from '@/lib/units';
import { renderSheetPdf } from '@/server/pdf/renderSheetPdf';
import { createTestTeam, createTestUser } from '../../helpers/fixtures';
import { testCopperBar } from '../../helpers/sheetCandidates';
import { actorOf } from './shareFixtures';

afterAll(() => closeDb());

const OVER_TIME_HEADING = 'Over time (chosen candidate)';
const ALONG_RUN_HEADING = 'Along the run (chosen candidate)';

/** 2 × 100 × 10 mm copper bars per phase (test input). */
// One bar per phase: the checks over time and along the run model one bar (a pack is rated in the steady state only).
const bar = testCopperBar(100, 10);

function barInputs(checksOn: boolean): SheetInputs {
  const inputs = defaultSheetInputs('bar-on-edge');
  inputs.circuit = { ...inputs.circuit, designCurrentA: 1800, lengthM: 12 };
  inputs.fault = { checked: true, currentA: 40000, durationS: 1 };
  inputs.environment = { ...inputs.environment, ambientC: 35 };
  inputs.candidates = [bar];
  inputs.chosenCandidateId = bar.id;
  inputs.notes = 'Transformer to switchboard busway (invented for tests).';
  // Daytime load above the design current, night load below it (input, invented).
  const dailyProfileA = Array.from({ length: 24 }, (_, hour) => (hour >= 9 && hour < 17 ? 2300 : 1200));
  inputs.overTime = { checked: checksOn, overloadCurrentA: 7000, overloadDurationS: 3600, dailyProfileA, faultWithCoverings: true };
  inputs.alongRun = {
    checked: checksOn,
    lengthM: 8,
    startEnd: 'terminal',
    startTemperatureC: 80,
    endEnd: 'terminal',
    endTemperatureC: 70,
    joints: [
      { positionM: 3, resistanceMicroOhm: null },
      { positionM: 6, resistanceMicroOhm: 15 },
    ],
  };
  return inputs;
}

/** Text of each page, whitespace folded (line breaks in the PDF become spaces). */
async function pagesOf(pdf: Buffer): Promise<string[]> {
  const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: false });
  return (text as string[]).map((page) => page.normalize('NFKC').replace(/\s+/g, ' '));
}

// NFKC on both sides: the PDF draws the micro sign µ from the Greek font, so it reads back as μ.
const fold = (s: string) => pdfSafeText(s).normalize('NFKC').replace(/\s+/g, ' ');
const c = (v: number) => `${formatNumber(v, 4)} °C`;

let withChecks: SheetRecord;
let withoutChecks: SheetRecord;

beforeAll(async () => {
  const team = await createTestTeam('beyond-pdf');
  const designer = (await createTestUser(team.id, 'designer')) as { id: string; role: 'designer' };
  const project = await createProject(team.id, designer.id, { name: 'Beyond steady PDF project (test)', site: 'Invented site' });
  const save = async (tag: string, inputs: SheetInputs) => {
    const created = await createSheet(team.id, actorOf(designer), { projectId: project.id, circuitTag: `${tag}-${Math.random().toString(36).slice(2, 7)}`.toUpperCase(), title: `${tag} busway`, inputs });
    return (await getSheet(team.id, created.id))!;
  };
  withChecks = await save('BEYOND', barInputs(true));
  withoutChecks = await save('STEADY', barInputs(false));
});

describe('PDF: "Over time" and "Along the run"', () => {
  it('prints the figures the library computes for the saved inputs, every flag of both checks, and the caution beside them', async () => {
    // The saved inputs are what the PDF reads; they must still hold the checks (schema v3 round trip).
    expect(withChecks.inputs.overTime.checked).toBe(true);
    expect(withChecks.inputs.alongRun.checked).toBe(true);
    const expected = computeBeyondSteady(withChecks.inputs, bar.id)!;
    if (!expected.overTime?.ok || !expected.alongRun?.ok) throw new Error(`the checks must compute for this sheet: ${JSON.stringify([expected.overTime, expected.alongRun]).slice(0, 400)}`);
    const t = expected.overTime.result;
    const a = expected.alongRun.result;
    // Each part of the over-time check has a result to print.
    expect(t.overload && t.daily && t.fault).toBeTruthy();

    const pages = await pagesOf(await renderSheetPdf(withChecks, new Date('2026-01-01T00:00:00Z')));
    const all = pages.join(' ');
    expect(all).toContain(OVER_TIME_HEADING);
    expect(all).toContain(ALONG_RUN_HEADING);

    // Over time: overload, daily peak, fault with heat into the surroundings against IEC 60949.
    const o = t.overload!;
    expect(o.outcome).toBe('reaches-limit');
    expect(all).toContain(
      `Overload ${formatNumber(o.currentA, 4)} A for ${formatNumber(o.durationS / 60, 3)} min from the steady state at the design current: the hot spot reaches the ${c(t.limitC)} limit after ${formatNumber(o.timeToLimitS! / 60, 3)} min — ${o.passes ? 'passes' : 'FAILS'}.`,
    );
    const d = t.daily!;
    expect(all).toContain(`Daily load (24 intervals) repeated ${d.days} days${d.periodic ? ' to a periodic state' : ' (not settled)'}: peak ${c(d.peakC)} at ${formatNumber(d.peakTimeS / 3600, 3)} h — ${d.passes ? 'passes' : 'FAILS'}.`);
    const f = t.fault!;
    expect(f.iecAdiabaticC).not.toBeNull();
    // A bare bar has no coverings: its heat flows into the surroundings.
    expect(all).toContain(`Fault with heat flowing into the surroundings: ${c(f.finalC)} at the end, against ${c(f.iecAdiabaticC!)} by the IEC 60949 adiabatic method`);

    // Along the run: hot spot and where, terminal heats, each joint (the one without a resistance marked assumed).
    expect(all).toContain(
      `Run of ${formatNumber(8, 4)} m: hot spot ${c(a.hotSpot.temperatureC)} at ${formatNumber(a.hotSpot.positionM, 3)} m against ${c(a.limitC)} — ${a.passes ? 'passes' : 'FAILS'}.`,
    );
    expect(all).toContain(`Heat into the start terminal ${formatNumber(a.heatIntoStartW, 3)} W, into the end ${formatNumber(a.heatIntoEndW, 3)} W.`);
    expect(a.joints).toHaveLength(2);
    a.joints.forEach((j, i) => {
      expect(all).toContain(fold(`Joint ${i + 1} at ${formatNumber(j.positionM, 3)} m: ${formatNumber(j.resistanceMicroOhm, 3)} µΩ${j.assumed ? ' (assumed)' : ''}, ${formatNumber(j.heatW, 3)} W, ${c(j.temperatureC)}.`));
    });
    expect(a.joints[0].assumed).toBe(true);
    expect(a.joints[1].assumed).toBe(false);

    // Flags: the fault and the un-entered joint resistance always raise one here; all are printed in full.
    const codes = [...t.flags, ...a.flags].map((x) => x.code);
    expect(codes).toContain('FAULT_HEAT_INTO_COVERINGS');
    expect(codes).toContain('JOINT_RESISTANCE_ASSUMED');
    // 7000 A is well above this bar's ampacity: the hour-long overload cannot be carried.
    expect(o.passes).toBe(false);
    expect(codes).toContain('OVERLOAD_LIMIT_REACHED');
    for (const flag of [...t.flags, ...a.flags]) expect(all).toContain(fold(`Flag: ${flagLine(flag)}`));

    // The caution on every page that shows these results.
    const showing = pages.filter((p) => p.includes(OVER_TIME_HEADING) || p.includes(ALONG_RUN_HEADING));
    expect(showing.length).toBeGreaterThan(0);
    for (const page of showing) for (const line of CAUTION_TEXT) expect(page).toContain(line);
  });

  it('a sheet saved with the checks off has neither section', async () => {
    expect(withoutChecks.inputs.overTime.checked).toBe(false);
    expect(computeBeyondSteady(withoutChecks.inputs, bar.id)).toEqual({ candidateId: bar.id });
    const all = (await pagesOf(await renderSheetPdf(withoutChecks, new Date('2026-01-01T00:00:00Z')))).join(' ');
    // The steady part is still there (so the text was read), the optional sections are not.
    expect(all).toContain(withoutChecks.circuitTag);
    expect(all).toContain(bar.label);
    expect(all).not.toContain(OVER_TIME_HEADING);
    expect(all).not.toContain(ALONG_RUN_HEADING);
    expect(all).not.toContain(flagTitle('FAULT_HEAT_INTO_COVERINGS'));
    expect(all).not.toContain(flagTitle('JOINT_RESISTANCE_ASSUMED'));
  });
});
