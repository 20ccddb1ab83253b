import { and, asc, count, desc, eq, like, or, sql, type SQL } from 'drizzle-orm';
import type { CaptureChannel, CaptureDetail, CaptureListQuery, CaptureSummary } from '../../shared/schemas/capture';
import type { PowerQuality } from '../../shared/schemas/powerQuality';
import type { User } from '../../shared/schemas/user';
import type { Db } from './client';
import { captures, channels, jobs, users } from './schema';
import { projectVisibleTo } from './visibilityRepository';

const summaryColumns = {
  id: captures.id,
  projectId: captures.projectId,
  name: captures.name,
  status: captures.status,
  errorCode: captures.errorCode,
  errorMessage: captures.errorMessage,
  errorLine: captures.errorLine,
  originalName: captures.originalName,
  sizeBytes: captures.sizeBytes,
  uploadedById: captures.uploadedBy,
  uploadedByName: users.name,
  createdAt: captures.createdAt,
  sampleRate: captures.sampleRate,
  sampleCount: captures.sampleCount,
  tags: captures.tags,
  channelCount: sql<number>`(SELECT COUNT(*) FROM channels ch WHERE ch.capture_id = ${captures.id})`,
  keyFigures: sql<string | null>`(SELECT JSON_OBJECT('rms', JSON_VALUE(ch.analysis, '$.rms'), 'frequency', JSON_VALUE(ch.analysis, '$.frequency'), 'thdPercent', JSON_VALUE(ch.analysis, '$.thdPercent'), 'crestFactor', JSON_VALUE(ch.analysis, '$.crestFactor'), 'unit', ch.unit) FROM channels ch WHERE ch.capture_id = ${captures.id} AND ch.idx = 0)`,
};

type SummaryRow = { [K in keyof typeof summaryColumns]: unknown };

const num = (v: unknown) => (v === null || v === undefined || v === 'null' ? null : Number(v));

function toSummary(r: SummaryRow): CaptureSummary {
  const key = typeof r.keyFigures === 'string' ? JSON.parse(r.keyFigures) : (r.keyFigures as Record<string, unknown> | null);
  const sampleRate = num(r.sampleRate);
  const sampleCount = num(r.sampleCount);
  return {
    id: r.id as number,
    projectId: r.projectId as number,
    name: r.name as string,
    status: r.status as CaptureSummary['status'],
    error: r.errorMessage ? { code: (r.errorCode as string) ?? 'invalid_csv', message: r.errorMessage as string, ...(r.errorLine != null ? { line: r.errorLine as number } : {}) } : null,
    originalName: r.originalName as string,
    sizeBytes: Number(r.sizeBytes),
    uploadedBy: r.uploadedById ? { id: r.uploadedById as number, name: (r.uploadedByName as string) ?? '' } : null,
    createdAt: (r.createdAt as Date).toISOString(),
    sampleRate,
    sampleCount,
    durationS: sampleRate && sampleCount ? sampleCount / sampleRate : null,
    channelCount: Number(r.channelCount),
    tags: (typeof r.tags === 'string' ? JSON.parse(r.tags) : r.tags) as string[],
    keyFigures:
      key && key.rms !== null && key.rms !== undefined
        ? { rms: Number(key.rms), frequency: num(key.frequency), thdPercent: num(key.thdPercent), crestFactor: num(key.crestFactor), unit: String(key.unit ?? '') }
        : null,
  };
}

/** A page of the captures `seenBy` may see: those in projects hidden from them are left out, total included. */
export async function listCaptures(db: Db, q: CaptureListQuery, seenBy: User): Promise<{ items: CaptureSummary[]; total: number }> {
  const where: SQL[] = [];
  const visible = projectVisibleTo(seenBy, captures.projectId);
  if (visible) where.push(visible);
  if (q.projectId) where.push(eq(captures.projectId, q.projectId));
  if (q.status) where.push(eq(captures.status, q.status));
  if (q.q) where.push(or(like(captures.name, `%${q.q}%`), like(captures.originalName, `%${q.q}%`)) as SQL);
  if (q.tag) where.push(sql`JSON_CONTAINS(${captures.tags}, JSON_QUOTE(${q.tag}))`);
  const cond = where.length ? and(...where) : undefined;
  const rows = await db
    .select(summaryColumns)
    .from(captures)
    .leftJoin(users, eq(users.id, captures.uploadedBy))
    .where(cond)
    .orderBy((q.order === 'asc' ? asc : desc)(captures[q.sort]), desc(captures.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(captures).where(cond);
  return { items: rows.map(toSummary), total: Number(total) };
}

export async function findCaptureSummary(db: Db, id: number): Promise<CaptureSummary | null> {
  const [row] = await db.select(summaryColumns).from(captures).leftJoin(users, eq(users.id, captures.uploadedBy)).where(eq(captures.id, id));
  return row ? toSummary(row) : null;
}

/** A capture with its channels: the capture row (with its summary) in one query, the channels in another. */
export async function findCaptureDetail(db: Db, id: number): Promise<CaptureDetail | null> {
  const [row] = await db
    .select({
      ...summaryColumns,
      t0: captures.t0,
      sha256: captures.sha256,
      detected: captures.detected,
      metadata: captures.metadata,
      engineVersion: captures.engineVersion,
      readyAt: captures.readyAt,
      channelSetup: captures.channelSetup,
      systems: captures.systems,
      declaredVoltage: captures.declaredVoltage,
      format: captures.format,
      dataName: captures.dataName,
      comtrade: captures.comtrade,
      reanalysing: sql<number>`EXISTS (SELECT 1 FROM ${jobs} WHERE ${jobs.captureId} = ${captures.id} AND ${jobs.kind} = 'reanalyse' AND ${jobs.status} IN ('queued', 'running'))`,
    })
    .from(captures)
    .leftJoin(users, eq(users.id, captures.uploadedBy))
    .where(eq(captures.id, id));
  if (!row) return null;
  // The detail is what a page polls while a capture is processed: two queries, and none of the channels'
  // analyses (5–15 KB of JSON each), which GET /captures/:id/analysis serves.
  const chans = await db.select({ idx: channels.idx, name: channels.name, unit: channels.unit, invalidCount: channels.invalidCount }).from(channels).where(eq(channels.captureId, id)).orderBy(asc(channels.idx));
  const parse = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;
  return {
    ...toSummary(row),
    t0: row.t0,
    sha256: row.sha256,
    channels: chans.map((c): CaptureChannel => ({ index: c.idx, name: c.name, unit: c.unit, invalidCount: c.invalidCount })),
    detected: parse(row.detected) ?? null,
    metadata: parse(row.metadata) ?? [],
    engineVersion: row.engineVersion,
    readyAt: row.readyAt ? row.readyAt.toISOString() : null,
    channelSetup: parse(row.channelSetup) ?? [],
    systemsSpec: parse(row.systems) ?? null,
    declaredVoltage: row.declaredVoltage,
    reanalysing: Boolean(Number(row.reanalysing)),
    format: row.format,
    dataName: row.dataName,
    comtrade: parse(row.comtrade) ?? null,
  };
}

export async function findCaptureRow(db: Db, id: number) {
  const [row] = await db.select().from(captures).where(eq(captures.id, id));
  return row ?? null;
}

export async function findCaptureBySha(db: Db, projectId: number, sha256: string) {
  const [row] = await db
    .select({ id: captures.id, status: captures.status })
    .from(captures)
    .where(and(eq(captures.projectId, projectId), eq(captures.sha256, sha256), sql`${captures.status} <> 'failed'`))
    .limit(1);
  return row ?? null;
}

/** Three-phase systems and voltage events stored with the capture's last analysis. */
export async function powerQualityOf(db: Db, id: number): Promise<PowerQuality> {
  const [row] = await db.select({ pq: captures.powerQuality }).from(captures).where(eq(captures.id, id));
  const pq = typeof row?.pq === 'string' ? (JSON.parse(row.pq) as PowerQuality) : row?.pq;
  return pq ?? { systems: [], voltageEvents: [] };
}

export async function channelAnalyses(db: Db, id: number): Promise<unknown[]> {
  const rows = await db.select({ analysis: channels.analysis }).from(channels).where(eq(channels.captureId, id)).orderBy(asc(channels.idx));
  return rows.map((r) => (typeof r.analysis === 'string' ? JSON.parse(r.analysis) : r.analysis));
}

/** What a meter simulation needs of a capture and one channel: status, time base, unit and stored fundamental. */
export async function findChannelTimeBase(db: Db, captureId: number, channel: number) {
  const [row] = await db
    .select({
      status: captures.status,
      errorMessage: captures.errorMessage,
      sampleRate: captures.sampleRate,
      sampleCount: captures.sampleCount,
      t0: captures.t0,
      channel: channels.idx,
      unit: channels.unit,
      frequency: sql<string | number | null>`JSON_VALUE(${channels.analysis}, '$.frequency')`,
    })
    .from(captures)
    .leftJoin(channels, and(eq(channels.captureId, captures.id), eq(channels.idx, channel)))
    .where(eq(captures.id, captureId));
  if (!row) return null;
  const frequency = row.frequency === null || row.frequency === 'null' ? null : Number(row.frequency);
  return { ...row, frequency: Number.isFinite(frequency) ? frequency : null };
}
