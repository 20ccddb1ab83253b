import type { ReportOptions } from '../../shared/schemas/report';
import type { AppContext } from '../context';
import { notFound } from '../errors';
import { exportFileName } from '../exports/exportFileName';
import { captureReportData, type ReportAuthor } from '../reports/captureReportData';
import { comparisonReportData } from '../reports/comparisonReportData';
import { openShare, sharedCaptureIds } from './shareService';

/**
 * The renderers are loaded on the first report, not at start-up: pdfkit and fontkit take 0.2–1.5 s to
 * load here, which every server start (and every test that starts one) would otherwise pay.
 */
const renderers = () => Promise.all([import('../reports/captureReport'), import('../reports/comparisonReport')]);

export interface ReportFile {
  pdf: Buffer;
  fileName: string;
}

/** A capture's report, for a signed-in person, with what they chose to add. */
export async function captureReport(ctx: AppContext, captureId: number, author: ReportAuthor): Promise<ReportFile> {
  const data = await captureReportData(ctx, captureId, author);
  const [{ renderCaptureReport }] = await renderers();
  return { pdf: await renderCaptureReport(data), fileName: exportFileName(data.capture.name, 'report.pdf', `capture-${captureId}`) };
}

/** A saved comparison's report. */
export async function comparisonReport(ctx: AppContext, comparisonId: number, author: ReportAuthor): Promise<ReportFile> {
  const data = await comparisonReportData(ctx, comparisonId, author);
  const [, { renderComparisonReport }] = await renderers();
  return { pdf: await renderComparisonReport(data), fileName: exportFileName(data.comparison.name, 'report.pdf', `comparison-${comparisonId}`) };
}

/** Reports opened through a share link carry no one's additions: they say whose link it is. */
const sharedAuthor = (sharedBy: string | null): ReportAuthor => ({ options: {}, preparedBy: `Crestline, from a read-only link shared by ${sharedBy ?? 'a Crestline user'}` });

/** The report of what a share link opens: its capture, or its comparison. Downloads are not counted as openings. */
export async function sharedReport(ctx: AppContext, token: string): Promise<ReportFile> {
  const share = await openShare(ctx, token, false);
  const author = sharedAuthor(share.sharedBy);
  return share.comparisonId ? comparisonReport(ctx, share.comparisonId, author) : captureReport(ctx, share.captureId as number, author);
}

/** The report of one capture of a share link (the shared capture, or one of a shared comparison's). */
export async function sharedCaptureReport(ctx: AppContext, token: string, captureId: number): Promise<ReportFile> {
  if (!(await sharedCaptureIds(ctx, token)).includes(captureId)) throw notFound('This shared capture');
  const share = await openShare(ctx, token, false);
  return captureReport(ctx, captureId, sharedAuthor(share.sharedBy));
}

/** The options a signed-in person's report carries; their name unless they give another. */
export const signedInAuthor = (userName: string, options: ReportOptions = {}): ReportAuthor => ({ options, preparedBy: userName });
