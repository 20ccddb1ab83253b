import type { PowerQuantities } from '../analysis';
import { formatRatio, formatSI } from '../units';

/**
 * The Power table's rows, [quantity, value, how it is formed], as the capture page and the PDF report
 * show them: the IEEE Std 1459-2010 single-phase quantities. `root` writes a square root: the page uses
 * √(…), the report "root of (…)" because its embedded Inter subsets may lack the radical sign.
 */
export function powerRows(q: PowerQuantities, root: (expr: string) => string = (e) => `√(${e})`): [string, string, string][] {
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
    ['Non-active power N', formatSI(q.nonActivePower, 'var'), root('S² − P²')],
    ['Non-fundamental apparent power SN', formatSI(q.nonFundamentalApparentPower, 'VA'), root('S² − S1²')],
    ['Current distortion power DI', formatSI(q.currentDistortionPower, 'var'), 'V1·IH'],
    ['Voltage distortion power DV', formatSI(q.voltageDistortionPower, 'var'), 'VH·I1'],
    ['THD of current / voltage', `${((q.thdI ?? 0) * 100).toFixed(1)} % / ${((q.thdV ?? 0) * 100).toFixed(1)} %`, 'IH/I1, VH/V1 (non-fundamental part, DC included)'],
  ];
}
