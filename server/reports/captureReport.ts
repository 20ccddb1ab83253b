import { formatUtc } from '../../shared/reports/formatQuantity';
import { formatSI } from '../../shared/units';
import type { CaptureReportData } from './captureReportData';
import { finishWithin } from './finishWithin';
import { ReportWriter } from './pdf/ReportWriter';
import { figuresSection, metersSection } from './sections/figuresSection';
import { harmonicsSection } from './sections/harmonicsSection';
import { instrumentSection } from './sections/instrumentSection';
import { limitChecksSection } from './sections/limitChecksSection';
import { marksSection, warningsSection } from './sections/notesSections';
import { powerSection, systemSection } from './sections/powerSection';
import { reportHeader } from './sections/reportHeader';
import { waveformSection } from './sections/waveformSection';

const cut = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/** Who, what and when, at the top of a capture report. */
function facts(d: CaptureReportData): [string, string][] {
  const c = d.capture;
  const { options } = d.author;
  return [
    ['Project', d.projectName ?? '—'],
    ['Capture', c.name],
    ['Original file', `${c.originalName} (${c.sizeBytes.toLocaleString('en')} bytes)`],
    ['SHA-256', c.sha256],
    ['Record', `${c.channels.length} channel(s) · ${formatSI(c.sampleRate, 'Hz', 4).replace('Hz', 'S/s')} · ${(c.sampleCount ?? 0).toLocaleString('en')} samples · ${formatSI(c.durationS, 's', 4)}`],
    ['Channels', c.channels.map((ch) => `${ch.name} (${ch.unit || 'no unit'})`).join(', ')],
    ['Uploaded', `${c.uploadedBy ? `by ${c.uploadedBy.name}, ` : ''}${formatUtc(c.createdAt)}`],
    ['Analysed', `Crestline engine version ${c.engineVersion ?? '—'}${c.readyAt ? `, ${formatUtc(c.readyAt)}` : ''}`],
    ['Prepared by', [options.preparedBy || d.author.preparedBy, options.company].filter(Boolean).join(', ')],
    ['Generated', formatUtc(d.generatedAt)],
  ];
}

/**
 * A capture's report as PDF: header and summary, the instrument's header lines, the waveform, figures,
 * meter readings, harmonics, power and system figures, warnings, marks, kept limit checks, and the
 * safety cautions, which are written even when the page limit cut the sections short.
 */
export async function renderCaptureReport(d: CaptureReportData): Promise<Buffer> {
  const title = d.author.options.title || `Capture report: ${d.capture.name}`;
  const w = new ReportWriter({
    title,
    subject: `Figures, harmonics and meter readings of the capture “${d.capture.name}”`,
    author: [d.author.options.preparedBy || d.author.preparedBy, d.author.options.company].filter(Boolean).join(', '),
    footer: `Crestline · ${cut(d.capture.name, 70)} · generated ${formatUtc(d.generatedAt)}`,
  });
  return finishWithin(w, [
    () => reportHeader(w, 'Capture report', title, facts(d), d.author.options),
    () => instrumentSection(w, d),
    () => waveformSection(w, d),
    () => figuresSection(w, d),
    () => metersSection(w, d),
    () => harmonicsSection(w, d),
    () => powerSection(w, d),
    () => systemSection(w, d),
    () => warningsSection(w, d.capture.channels, d.analyses),
    () => marksSection(w, d),
    () => limitChecksSection(w, d),
  ]);
}
