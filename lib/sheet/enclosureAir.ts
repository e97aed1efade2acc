/**
 * The sheet's optional check "Inside the enclosure" for one candidate (physics.md §6), from the
 * sheet inputs, with lib/electrical. Same function on the screen and in the PDF.
 */
import { enclosureAirCheck, type EnclosureAirCheckResult, type EnclosureAirInputs } from '../electrical/sizing/enclosureAir';
import { checkFailure, type CheckOutcome } from './beyondSteady';
import type { SheetInputs } from './schema';
import { toCandidates, toConditions } from './toSizing';

/** The enclosure of the sheet as the library takes it; null when the check is off or the circuit is buried. */
export function enclosureAirInputsOf(inputs: SheetInputs): EnclosureAirInputs | null {
  if (!inputs.enclosureAir.checked || inputs.installation.kind === 'buried') return null;
  const e = inputs.enclosureAir;
  return {
    shape: { heightM: e.heightM, widthM: e.widthM, depthM: e.depthM, backCovered: e.backCovered, sidesCovered: e.sidesCovered, topCovered: e.topCovered },
    wall: e.wall,
    outsideAirC: e.outsideAirC,
    routeLengthInsideM: e.routeLengthInsideM,
    otherLossesW: e.otherLossesW,
  };
}

/** The check for the candidate `candidateId`; null when it is not checked or the candidate is not on the sheet. */
export function computeEnclosureAir(inputs: SheetInputs, candidateId: string): CheckOutcome<EnclosureAirCheckResult> | null {
  if (!inputs.enclosureAir.checked) return null;
  const index = inputs.candidates.findIndex((c) => c.id === candidateId);
  if (index < 0) return null;
  if (inputs.installation.kind === 'buried') return { ok: false, message: 'A buried circuit is not inside an enclosure.' };
  try {
    return { ok: true, result: enclosureAirCheck(toCandidates(inputs)[index], toConditions(inputs), enclosureAirInputsOf(inputs)!) };
  } catch (error) {
    return checkFailure(error);
  }
}
