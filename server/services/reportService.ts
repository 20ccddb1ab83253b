import type { ReportOptions } from '../../shared/schemas/report';
import type { AppContext } from '../context';
import { notFound } from '../errors';
import { exportFileName } from '../exports/exportFileName';
import { renderCaptureReport } from '../reports/captureReport';
import { captureReportData, type ReportAuthor } from '../reports/captureReportData';
import { renderComparisonReport } from '../reports/comparisonReport';
import { comparisonReportData } from '../reports/comparisonReportData';
import { openShare, sharedCaptureIds } from './shareService';

export interface ReportFile {
  pdf: Buffer;
  fileName: string;
}

/** A capture's report, for a signed-in person, with what they chose to add. */
export async function captureReport(ctx: AppContext, captureId: number, author: ReportAuthor): Promise<ReportFile> {
  const data = await captureReportData(ctx, captureId, author);
  return { pdf: await renderCaptureReport(data), fileName: exportFileName(data.capture.name, 'report.pdf', `capture-${captureId}`) };
}

/** A saved comparison's report. */
export async function comparisonReport(ctx: AppContext, comparisonId: number, author: ReportAuthor): Promise<ReportFile> {
  const data = await comparisonReportData(ctx, comparisonId, author);
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
