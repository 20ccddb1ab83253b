import type { Response } from 'express';
import type { ReportFile } from '../services/reportService';

/** Answers a generated PDF as a download. */
export function sendPdf(res: Response, file: ReportFile): void {
  res.attachment(file.fileName);
  res.type('application/pdf');
  res.set('Cache-Control', 'no-store');
  res.send(file.pdf);
}
