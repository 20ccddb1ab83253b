import { REPORT_COLOURS as C } from '../../../shared/reports/palette';
import { SAFETY_CAUTIONS, SAFETY_CLOSING } from '../../../shared/reports/safetyCautions';
import type { ChannelAnalysis } from '../../../shared/schemas/analysis';
import type { CaptureChannel } from '../../../shared/schemas/capture';
import { formatSI } from '../../../shared/units';
import type { CaptureReportData } from '../captureReportData';
import { drawTable } from '../pdf/pdfTable';
import type { ReportWriter } from '../pdf/ReportWriter';

/** Characters of a mark's note printed at most. */
const NOTE_CHARS = 1000;
const SEVERITY_COLOUR = { danger: C.danger, warning: '#a16207', info: C.muted } as const;

/** The engine's warnings, per channel, in its own words. */
export function warningsSection(w: ReportWriter, channels: CaptureChannel[], analyses: ChannelAnalysis[], heading = 'Warnings'): void {
  w.heading(heading);
  let any = false;
  channels.forEach((c, i) => {
    for (const x of analyses[i]?.warnings ?? []) {
      any = true;
      w.paragraph(`${c.name} · ${x.severity}: ${x.message}`, { size: 8.5, color: SEVERITY_COLOUR[x.severity] });
    }
  });
  if (!any) w.paragraph('None: the engine found nothing to warn about.', { color: C.muted });
}

/** The engineers' marks with their notes. */
export function marksSection(w: ReportWriter, d: CaptureReportData): void {
  w.heading('Marks');
  if (!d.marks.length) {
    w.paragraph('No marks on this capture.', { color: C.muted });
    return;
  }
  drawTable(
    w,
    [{ header: 'From – to', share: 1.6 }, { header: 'Channel', share: 1 }, { header: 'Mark', share: 1.6 }, { header: 'Severity', share: 0.8 }, { header: 'Note', share: 3.4 }],
    d.marks.map((m) => [
      `${formatSI(m.startS, 's', 5)} – ${formatSI(m.endS, 's', 5)}`,
      m.channelIdx === null ? 'all' : d.capture.channels[m.channelIdx]?.name ?? '—',
      m.label,
      m.severity,
      [m.note.length > NOTE_CHARS ? `${m.note.slice(0, NOTE_CHARS)}…` : m.note, m.source === 'finder' ? `(found by the anomaly finder${m.reason ? `: ${m.reason}` : ''})` : m.createdBy ? `(${m.createdBy.name})` : ''].filter(Boolean).join(' '),
    ]),
  );
}

/** The safety cautions every report ends with. */
export function safetySection(w: ReportWriter): void {
  w.heading('Working safely');
  for (const s of SAFETY_CAUTIONS) w.paragraph(`•  ${s}`, { size: 8.5 });
  w.paragraph(SAFETY_CLOSING, { size: 8.5, weight: 'bold' });
}
