import { CHANNEL_COLOURS } from '../../../shared/reports/palette';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTimePlot } from '../pdf/pdfPlot';
import type { ReportWriter } from '../pdf/ReportWriter';

/** Each channel over its analysis window, from the stored samples or min/max pyramid, as vector paths. */
export function waveformSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Waveform over the analysis window', 1, 180);
  d.waveforms.forEach((s, k) => {
    const c = d.capture.channels[s.channel];
    const a = d.analyses[s.channel];
    const span = a.window.cycles === null ? 'the whole record (no steady fundamental)' : `${a.window.cycles} whole cycles`;
    w.ensureSpace(175);
    w.text(`${c.name}: ${span}, ${formatSI(a.window.startS, 's', 4)} to ${formatSI(a.window.endS, 's', 4)}${s.mode === 'minmax' ? ', drawn as the minimum and maximum of each stretch of samples' : ''}`, { size: 8, color: '#686357' });
    w.block(155, (box) =>
      drawTimePlot(w, box, {
        traces: [{ label: `${c.name} (${c.unit || 'no unit'})`, color: CHANNEL_COLOURS[k % CHANNEL_COLOURS.length], t0S: s.t0S, stepS: s.stepS, ...(s.mode === 'raw' ? { values: s.values } : { min: s.min, max: s.max }) }],
        xRange: [a.window.startS, a.window.endS],
        xLabel: 'Time (s)',
        yLabel: c.unit ? `${c.name} (${c.unit})` : c.name,
        yUnit: c.unit,
      }),
    );
  });
}
