/**
 * The inputs of the bus-bar system, the protection and the harmonics (sheet version 6) as rows of
 * the printed inputs table (lib/sheet/sheetTables inputRows): the share view, the PDF and the
 * exports print them in the same words. SI units, as stored. Pure TypeScript.
 */
import { formatNumber } from '../units';
import type { SheetInputs } from './schema';
import type { InputRow } from './sheetTables';
import { DEVICE_KIND_WORDS, SUPPORT_WORDS } from './systemSchema';
import { barPlacement } from './systemToSizing';

const n = (value: number, digits = 4) => formatNumber(value, digits);

export function systemInputRows(inputs: SheetInputs): InputRow[] {
  const rows: InputRow[] = [];
  const b = inputs.busbarSystem;
  if (barPlacement(inputs) !== null) {
    const S = 'Bus-bar system';
    rows.push(
      { section: S, label: 'Gap between the bars of a pack', value: b.barGapM === null ? 'each candidate’s own (the bar thickness)' : n(b.barGapM * 1000), unit: b.barGapM === null ? '' : 'mm' },
      { section: S, label: 'Phase spacing (centre to centre)', value: b.phaseSpacingM === null ? 'not entered (assumed, flagged)' : n(b.phaseSpacingM * 1000), unit: b.phaseSpacingM === null ? '' : 'mm' },
      { section: S, label: 'Support spacing', value: b.supportSpacingM === null ? 'not described' : n(b.supportSpacingM * 1000), unit: b.supportSpacingM === null ? '' : 'mm' },
      { section: S, label: 'Spacer spacing', value: b.spacerSpacingM === null ? 'at the supports' : n(b.spacerSpacingM * 1000), unit: b.spacerSpacingM === null ? '' : 'mm' },
      { section: S, label: 'How the bars are held', value: b.supports === null ? 'not described (forces not checked)' : SUPPORT_WORDS[b.supports], unit: '' },
      { section: S, label: 'Rated strength of a support', value: b.supportStrengthN === null ? 'not entered' : n(b.supportStrengthN), unit: b.supportStrengthN === null ? '' : 'N' },
      {
        section: S,
        label: 'Peak factor κ',
        value: b.peakFactorBy === 'assumed' ? '2.0 assumed (flagged)' : b.peakFactorBy === 'kappa' ? n(b.kappa) : `from R/X = ${n(b.rOverX, 3)} (IEC 60909-0)`,
        unit: '',
      },
      { section: S, label: 'Bars of a pack', value: b.packNodes === 'per-bar' ? 'each at its own temperature' : 'bonded to one temperature (flagged)', unit: '' },
    );
  }
  const p = inputs.protection;
  const P = 'Protection';
  if (!p.included) {
    rows.push({ section: P, label: 'Protective device', value: 'not described (not checked)', unit: '' });
  } else {
    const d = p.device;
    rows.push(
      { section: P, label: 'Protective device', value: `${DEVICE_KIND_WORDS[d.kind]}${d.kind === 'breaker-iec60898-1' ? `, curve ${d.curve}` : ''}`, unit: '' },
      { section: P, label: d.kind === 'breaker-iec60947-2' ? 'Rated current' : 'Rating I_n', value: n(d.ratedCurrentA), unit: 'A' },
    );
    if (d.kind === 'breaker-iec60947-2') {
      rows.push(
        { section: P, label: 'Setting I_r', value: d.settingCurrentA === null ? '—' : n(d.settingCurrentA), unit: 'A' },
        { section: P, label: 'Instantaneous setting I_i', value: d.instantaneousCurrentA === null ? '—' : n(d.instantaneousCurrentA), unit: 'A' },
        { section: P, label: 'Instantaneous break time', value: d.instantaneousMaxTimeS === null ? '0.1 assumed (flagged)' : n(d.instantaneousMaxTimeS, 3), unit: d.instantaneousMaxTimeS === null ? '' : 's' },
        { section: P, label: 'Trip-unit settings searched', value: d.settingStepsA.length === 0 ? 'none given' : d.settingStepsA.map((v) => n(v)).join(', '), unit: d.settingStepsA.length === 0 ? '' : 'A' },
      );
    }
    rows.push(
      { section: P, label: 'Conventional operating current I₂', value: d.conventionalOperatingCurrentA === null ? 'by the device standard (from memory)' : n(d.conventionalOperatingCurrentA), unit: d.conventionalOperatingCurrentA === null ? '' : 'A' },
      { section: P, label: 'Time–current curve', value: d.timeCurrentCurve.length === 0 ? 'none entered' : d.timeCurrentCurve.map((pt) => `${n(pt.currentA)} A ${n(pt.timeS, 3)} s`).join('; '), unit: '' },
      { section: P, label: 'Circuit', value: p.circuitRole === 'final' ? 'final circuit' : 'distribution circuit', unit: '' },
      { section: P, label: 'Earthing', value: p.earthing, unit: '' },
    );
    if (p.earthing === 'TT') rows.push({ section: P, label: 'Earth electrodes R_A + R_B', value: p.earthElectrodesOhm === null ? '—' : n(p.earthElectrodesOhm), unit: 'Ω' });
    rows.push({
      section: P,
      label: 'Source impedance',
      value: p.sourceBy === 'not-entered' ? 'not entered (disconnection not checked)' : p.sourceBy === 'r-and-x' ? `R ${n(p.sourceResistanceOhm * 1000)}, X ${n(p.sourceReactanceOhm * 1000)}` : `|Z| ${n(p.sourceImpedanceOhm * 1000)}`,
      unit: p.sourceBy === 'not-entered' ? '' : 'mΩ',
    });
    const pe = p.protectiveConductor;
    rows.push({
      section: P,
      label: 'Protective conductor',
      value: pe.entered ? `${n(pe.sectionMm2)} mm², ${pe.material === 'same' ? 'the candidate’s metal' : pe.material}, ${pe.insulation}, ${pe.arrangement === 'separate' ? 'separate' : 'in the cable or bunched'}` : 'not described',
      unit: '',
    });
  }
  const h = inputs.harmonics.thirdHarmonicPercent;
  rows.push({ section: P, label: 'Third-harmonic content', value: h === null ? 'not entered (none)' : n(h, 3), unit: h === null ? '' : '%' });
  return rows;
}
