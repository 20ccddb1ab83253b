import { Router } from 'express';
import { ReportOptions } from '../../shared/schemas/report';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { currentUser } from '../middleware/auth';
import { captureReport, comparisonReport, signedInAuthor } from '../services/reportService';
import { sendPdf } from './sendFile';

/**
 * PDF reports, for every signed-in role (a report is a read). GET gives the plain report; POST takes a
 * title, summary, name and company in its body (too long for a URL) and answers the same PDF with them.
 */
export function reportRoutes(ctx: AppContext): Router {
  return Router()
    .get('/captures/:id/report.pdf', async (req, res) => {
      sendPdf(res, await captureReport(ctx, IdParam.parse(req.params).id, signedInAuthor(currentUser(req).name)));
    })
    .post('/captures/:id/report.pdf', async (req, res) => {
      const options = ReportOptions.parse(req.body ?? {});
      sendPdf(res, await captureReport(ctx, IdParam.parse(req.params).id, signedInAuthor(currentUser(req).name, options)));
    })
    .get('/comparisons/:id/report.pdf', async (req, res) => {
      sendPdf(res, await comparisonReport(ctx, IdParam.parse(req.params).id, signedInAuthor(currentUser(req).name)));
    })
    .post('/comparisons/:id/report.pdf', async (req, res) => {
      const options = ReportOptions.parse(req.body ?? {});
      sendPdf(res, await comparisonReport(ctx, IdParam.parse(req.params).id, signedInAuthor(currentUser(req).name, options)));
    });
}
