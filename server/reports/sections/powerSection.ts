import type { PowerQuantities } from '../../../shared/analysis';
import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { siQuantityOf } from '../../../shared/siUnits';
import { formatRatio, formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';

/** The Power panel's rows: IEEE Std 1459-2010 single-phase quantities, with how each is formed. */
function powerRows(q: PowerQuantities): [string, string, string][] {
  const f = q.fundamental;
  return [
    ['Active power P', formatSI(q.activePower, 'W'), 'mean of v·i over whole cycles'],
    ['Apparent power S', formatSI(q.apparentPower, 'VA'), 'V·I (true RMS values)'],
    ['Power factor PF', formatRatio(q.powerFactor), 'P/S'],
    ['Displacement power factor', formatRatio(f.displacementPowerFactor), `cos θ1; the current ${f.phaseDeg >= 0 ? 'lags' : 'leads'} by ${Math.abs(f.phaseDeg).toFixed(1)}°`],
    ['Fundamental active power P1', formatSI(f.activePower, 'W'), 'V1·I1·cos θ1'],
    ['Fundamental reactive power Q1', formatSI(f.reactivePower, 'var'), 'V1·I1·sin θ1'],
    ['Fundamental apparent power S1', formatSI(f.apparentPower, 'VA'), 'V1·I1'],
    ['Harmonic active power PH', formatSI(q.harmonicActivePower, 'W'), 'P − P1'],
    ['Non-active power N', formatSI(q.nonActivePower, 'var'), 'root of (S² − P²)'],
    ['Non-fundamental apparent power SN', formatSI(q.nonFundamentalApparentPower, 'VA'), 'root of (S² − S1²)'],
    ['Current distortion power DI', formatSI(q.currentDistortionPower, 'var'), 'V1·IH'],
    ['Voltage distortion power DV', formatSI(q.voltageDistortionPower, 'var'), 'VH·I1'],
    ['THD of current / voltage', `${((q.thdI ?? 0) * 100).toFixed(1)} % / ${((q.thdV ?? 0) * 100).toFixed(1)} %`, 'IH/I1, VH/V1 (DC included)'],
  ];
}

/** Power figures of each voltage/current pair, where the capture has both. */
export function powerSection(w: ReportWriter, d: CaptureReportData): void {
  if (!d.power.length) return;
  w.heading('Power');
  for (const p of d.power) {
    w.heading(`${p.voltage.name} with ${p.current.name}`, 2);
    if (!p.quantities) {
      w.paragraph(p.note ?? 'Not defined for this pair.', { color: C.muted });
      continue;
    }
    w.paragraph(`IEEE Std 1459-2010 quantities, single-phase, over ${p.quantities.window.cycles} whole cycles at ${formatSI(p.quantities.frequency, 'Hz', 5)}. Assumes the probes' polarity and scaling are right.`, { size: 8, color: C.muted });
    drawTable(w, [{ header: 'Quantity', share: 2.4 }, { header: 'Value', share: 1.3, align: 'right' }, { header: 'Formed as', share: 2.4 }], powerRows(p.quantities));
  }
}

/**
 * Three-phase system figures (effective voltage and current, unbalance, positive-sequence powers) will
 * go here. Until they are computed, a capture with three or more voltage or current channels says so,
 * so that nobody reads the per-channel figures as system figures.
 */
export function systemSection(w: ReportWriter, d: CaptureReportData): void {
  const count = (q: 'voltage' | 'current') => d.capture.channels.filter((c) => siQuantityOf(c.unit)?.quantity === q).length;
  if (count('voltage') < 3 && count('current') < 3) return;
  w.heading('System figures');
  w.paragraph('This capture holds three or more voltage or current channels. Three-phase system figures (effective values, unbalance, positive-sequence power) are not computed by this version of Crestline; the figures above are per channel.');
}
