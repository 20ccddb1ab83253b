import { asc, count, eq } from 'drizzle-orm';
import type { ComplianceRequest } from '../../shared/schemas/compliance';
import type { Db } from './client';
import { limitChecks, users } from './schema';

export interface LimitCheckRow {
  id: number;
  captureId: number;
  request: ComplianceRequest;
  createdBy: { id: number; name: string } | null;
  createdAt: Date;
}

const columns = { id: limitChecks.id, captureId: limitChecks.captureId, request: limitChecks.request, createdById: limitChecks.createdBy, createdByName: users.name, createdAt: limitChecks.createdAt };
type Row = { id: number; captureId: number; request: unknown; createdById: number | null; createdByName: string | null; createdAt: Date };
const toCheck = (r: Row): LimitCheckRow => ({
  id: r.id,
  captureId: r.captureId,
  // MariaDB keeps JSON as LONGTEXT, so the driver may hand back the text.
  request: (typeof r.request === 'string' ? JSON.parse(r.request) : r.request) as ComplianceRequest,
  createdBy: r.createdById ? { id: r.createdById, name: r.createdByName ?? '' } : null,
  createdAt: r.createdAt,
});

export async function listLimitChecks(db: Db, captureId: number): Promise<LimitCheckRow[]> {
  const rows = await db.select(columns).from(limitChecks).leftJoin(users, eq(users.id, limitChecks.createdBy)).where(eq(limitChecks.captureId, captureId)).orderBy(asc(limitChecks.id));
  return rows.map(toCheck);
}

export async function findLimitCheck(db: Db, id: number): Promise<LimitCheckRow | null> {
  const [row] = await db.select(columns).from(limitChecks).leftJoin(users, eq(users.id, limitChecks.createdBy)).where(eq(limitChecks.id, id));
  return row ? toCheck(row) : null;
}

export async function countLimitChecks(db: Db, captureId: number): Promise<number> {
  const [{ n }] = await db.select({ n: count() }).from(limitChecks).where(eq(limitChecks.captureId, captureId));
  return Number(n);
}

export async function insertLimitCheck(db: Db, captureId: number, request: ComplianceRequest, userId: number): Promise<number> {
  const [{ id }] = await db.insert(limitChecks).values({ captureId, request, createdBy: userId }).$returningId();
  return id;
}

export async function deleteLimitCheck(db: Db, id: number): Promise<void> {
  await db.delete(limitChecks).where(eq(limitChecks.id, id));
}
