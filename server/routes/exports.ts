import { Router, type Response } from 'express';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { CsvQuery, SamplesExportQuery } from '../../shared/schemas/export';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { csvDialect, csvDocument } from '../exports/csvWriter';
import { exportFileName } from '../exports/exportFileName';
import { figuresJson, figuresTable } from '../exports/figuresExport';
import { harmonicsJson, harmonicsTable } from '../exports/harmonicsExport';
import { sampleSpan, samplesCsv, samplesJson } from '../exports/samplesExport';
import { readyCapture } from '../services/readyCapture';

const fileOf = (c: { id: number; name: string }, suffix: string) => exportFileName(c.name, suffix, `capture-${c.id}`);

function download(res: Response, fileName: string, type: string): Response {
  return res.attachment(fileName).type(type);
}

/**
 * CSV and JSON exports of a capture, for every signed-in role. Samples stream block by block, within
 * EXPORT_MAX_SAMPLES per channel.
 */
export function exportRoutes(ctx: AppContext): Router {
  return Router()
    .get('/captures/:id/figures.csv', async (req, res) => {
      const q = CsvQuery.parse(req.query);
      const cap = await readyCapture(ctx, IdParam.parse(req.params).id);
      const t = figuresTable(cap);
      download(res, fileOf(cap.detail, 'figures.csv'), 'text/csv; charset=utf-8').send(csvDocument(t.header, t.rows, csvDialect(q)));
    })
    .get('/captures/:id/figures.json', async (req, res) => {
      const cap = await readyCapture(ctx, IdParam.parse(req.params).id);
      download(res, fileOf(cap.detail, 'figures.json'), 'application/json').json(figuresJson(cap));
    })
    .get('/captures/:id/harmonics.csv', async (req, res) => {
      const q = CsvQuery.parse(req.query);
      const cap = await readyCapture(ctx, IdParam.parse(req.params).id);
      const t = harmonicsTable(cap);
      download(res, fileOf(cap.detail, 'harmonics.csv'), 'text/csv; charset=utf-8').send(csvDocument(t.header, t.rows, csvDialect(q)));
    })
    .get('/captures/:id/harmonics.json', async (req, res) => {
      const cap = await readyCapture(ctx, IdParam.parse(req.params).id);
      download(res, fileOf(cap.detail, 'harmonics.json'), 'application/json').json(harmonicsJson(cap));
    })
    .get('/captures/:id/samples.csv', async (req, res) => {
      const q = SamplesExportQuery.parse(req.query);
      const { detail } = await readyCapture(ctx, IdParam.parse(req.params).id);
      const span = sampleSpan(detail, q, ctx.config.EXPORT_MAX_SAMPLES);
      download(res, fileOf(detail, 'samples.csv'), 'text/csv; charset=utf-8');
      await pipeline(Readable.from(samplesCsv(ctx, span, csvDialect(q))), res);
    })
    .get('/captures/:id/samples.json', async (req, res) => {
      const q = SamplesExportQuery.parse(req.query);
      const { detail } = await readyCapture(ctx, IdParam.parse(req.params).id);
      const span = sampleSpan(detail, q, ctx.config.EXPORT_MAX_SAMPLES);
      download(res, fileOf(detail, 'samples.json'), 'application/json');
      await pipeline(Readable.from(samplesJson(ctx, span)), res);
    });
}
