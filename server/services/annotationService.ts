import { and, asc, eq, isNull, ne } from 'drizzle-orm';
import type { Annotation, Comment, CreateAnnotationRequest, UpdateAnnotationRequest } from '../../shared/schemas/annotation';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { findCaptureRow } from '../db/captureRepository';
import { annotations, comments, users } from '../db/schema';
import { AppError, forbidden, notFound } from '../errors';

const annotationColumns = {
  id: annotations.id,
  captureId: annotations.captureId,
  channelIdx: annotations.channelIdx,
  startS: annotations.startS,
  endS: annotations.endS,
  label: annotations.label,
  note: annotations.note,
  severity: annotations.severity,
  source: annotations.source,
  state: annotations.state,
  reason: annotations.reason,
  createdById: annotations.createdBy,
  createdByName: users.name,
  createdAt: annotations.createdAt,
};

type Row = { [K in keyof typeof annotationColumns]: unknown };
const toAnnotation = (r: Row): Annotation => ({
  id: r.id as number,
  captureId: r.captureId as number,
  channelIdx: (r.channelIdx as number | null) ?? null,
  startS: r.startS as number,
  endS: r.endS as number,
  label: r.label as string,
  note: r.note as string,
  severity: r.severity as Annotation['severity'],
  source: r.source as Annotation['source'],
  state: r.state as Annotation['state'],
  reason: (r.reason as string | null) ?? null,
  createdBy: r.createdById ? { id: r.createdById as number, name: (r.createdByName as string) ?? '' } : null,
  createdAt: (r.createdAt as Date).toISOString(),
});

async function requireCapture(ctx: AppContext, captureId: number) {
  const c = await findCaptureRow(ctx.db, captureId);
  if (!c) throw notFound('Capture');
  return c;
}

async function findAnnotation(ctx: AppContext, id: number): Promise<Annotation> {
  const [row] = await ctx.db.select(annotationColumns).from(annotations).leftJoin(users, eq(users.id, annotations.createdBy)).where(eq(annotations.id, id));
  if (!row) throw notFound('Annotation');
  return toAnnotation(row);
}

export async function listAnnotations(ctx: AppContext, captureId: number): Promise<Annotation[]> {
  await requireCapture(ctx, captureId);
  const rows = await ctx.db
    .select(annotationColumns)
    .from(annotations)
    .leftJoin(users, eq(users.id, annotations.createdBy))
    .where(and(eq(annotations.captureId, captureId), ne(annotations.state, 'dismissed')))
    .orderBy(asc(annotations.startS));
  return rows.map(toAnnotation);
}

export async function createAnnotation(ctx: AppContext, user: User, captureId: number, req: CreateAnnotationRequest): Promise<Annotation> {
  await requireCapture(ctx, captureId);
  const [{ id }] = await ctx.db.insert(annotations).values({ captureId, ...req, createdBy: user.id }).$returningId();
  return findAnnotation(ctx, id);
}

/**
 * Whoever owns a mark: its author, or for a finder suggestion whoever accepted it. An unaccepted
 * suggestion belongs to nobody.
 */
const ownerOf = (a: Annotation) => a.createdBy?.id ?? null;
const mayChange = (user: User, a: Annotation) => user.role === 'admin' || ownerOf(a) === user.id;

/**
 * Edits, accepts or dismisses a mark. An owned mark: its owner or an admin. A suggestion nobody has
 * accepted yet: any engineer or admin, and accepting it makes the accepter its owner; once owned, the
 * mark cannot be taken over by accepting it again.
 */
export async function updateAnnotation(ctx: AppContext, user: User, id: number, req: UpdateAnnotationRequest): Promise<Annotation> {
  const a = await findAnnotation(ctx, id);
  const owner = ownerOf(a);
  if (owner !== null && !mayChange(user, a)) throw forbidden('Only whoever made or accepted this mark, or an admin, may change it');
  const patch: Partial<typeof annotations.$inferInsert> = { ...req };
  if (owner === null && req.state === 'active') patch.createdBy = user.id;
  // The condition repeats the owner check in the write, so two engineers accepting at once cannot both win.
  const stillAsRead = owner === null ? isNull(annotations.createdBy) : eq(annotations.createdBy, owner);
  const [result] = await ctx.db.update(annotations).set(patch).where(and(eq(annotations.id, id), stillAsRead));
  if (result.affectedRows === 0) throw new AppError(409, 'changed_meanwhile', 'Someone else changed this mark meanwhile; reload and try again');
  return findAnnotation(ctx, id);
}

export async function deleteAnnotation(ctx: AppContext, user: User, id: number): Promise<void> {
  const a = await findAnnotation(ctx, id);
  if (!mayChange(user, a)) throw forbidden('Only whoever made or accepted this mark, or an admin, may delete it');
  await ctx.db.delete(annotations).where(eq(annotations.id, id));
}

export async function listComments(ctx: AppContext, captureId: number): Promise<Comment[]> {
  await requireCapture(ctx, captureId);
  const rows = await ctx.db
    .select({ id: comments.id, captureId: comments.captureId, body: comments.body, createdById: comments.createdBy, createdByName: users.name, createdAt: comments.createdAt })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.createdBy))
    .where(eq(comments.captureId, captureId))
    .orderBy(asc(comments.createdAt), asc(comments.id));
  return rows.map((r) => ({ id: r.id, captureId: r.captureId, body: r.body, createdBy: r.createdById ? { id: r.createdById, name: r.createdByName ?? '' } : null, createdAt: r.createdAt.toISOString() }));
}

export async function addComment(ctx: AppContext, user: User, captureId: number, body: string): Promise<Comment> {
  await requireCapture(ctx, captureId);
  await ctx.db.insert(comments).values({ captureId, body, createdBy: user.id });
  const all = await listComments(ctx, captureId);
  return all[all.length - 1];
}
