import type { ChannelAnalysis } from '../../shared/schemas/analysis';
import type { Annotation } from '../../shared/schemas/annotation';
import type { CaptureDetail, SamplesResponse } from '../../shared/schemas/capture';
import type { StoredLimitCheck } from '../../shared/schemas/compliance';
import type { ReportOptions } from '../../shared/schemas/report';
import type { AppContext } from '../context';
import { findProject } from '../db/projectRepository';
import { listAnnotations } from '../services/annotationService';
import { keptChecks } from '../services/limitCheckService';
import { powerFigures, type PowerPair } from '../services/powerFiguresService';
import { readyCapture } from '../services/readyCapture';
import { sampleWindow } from '../services/sampleWindowService';

/** Channels a report covers; a capture with more lists the rest by name only. */
export const REPORT_MAX_CHANNELS = 8;
/** Marks listed at most. */
export const REPORT_MAX_MARKS = 100;
/** Points per plotted waveform: as many as a page's width shows. */
const PLOT_POINTS = 900;

/** Who the report is made for and by: the signed-in person's options, or a share link's read-only view. */
export interface ReportAuthor {
  options: ReportOptions;
  /** The signed-in user's name, or "a read-only link shared by …". */
  preparedBy: string;
}

export interface CaptureReportData {
  capture: CaptureDetail;
  analyses: ChannelAnalysis[];
  projectName: string | null;
  waveforms: SamplesResponse[];
  marks: Annotation[];
  checks: StoredLimitCheck[];
  power: PowerPair[];
  author: ReportAuthor;
  generatedAt: Date;
}

/** Everything a capture report shows, read once: 404 for an unknown capture, 409 while it is not ready. */
export async function captureReportData(ctx: AppContext, captureId: number, author: ReportAuthor): Promise<CaptureReportData> {
  const { detail, analyses } = await readyCapture(ctx, captureId);
  const shown = detail.channels.slice(0, REPORT_MAX_CHANNELS);
  const waveforms: SamplesResponse[] = [];
  for (const c of shown) {
    const a = analyses[c.index];
    waveforms.push(await sampleWindow(ctx, captureId, { channel: c.index, fromS: a.window.startS, toS: a.window.endS, points: PLOT_POINTS }));
  }
  const marks = (await listAnnotations(ctx, captureId)).filter((m) => m.state === 'active').slice(0, REPORT_MAX_MARKS);
  return {
    capture: detail,
    analyses,
    projectName: (await findProject(ctx.db, detail.projectId))?.name ?? null,
    waveforms,
    marks,
    checks: await keptChecks(ctx, { detail, analyses }),
    power: await powerFigures(ctx, detail),
    author,
    generatedAt: new Date(),
  };
}
