import bcrypt from 'bcryptjs';
import { writeFile, mkdir } from 'node:fs/promises';
import path from 'node:path';
import { demoCaptures, demoCsv } from '../demo/demoWaveforms';
import { acceptUpload } from '../services/captureService';
import type { AppContext } from '../context';
import { findUserByEmail, insertUser } from './userRepository';
import { eq } from 'drizzle-orm';
import { insertProject, listProjects } from './projectRepository';
import { captures } from './schema';
import { seedMeterProfiles } from './seedMeterProfiles';
import type { Role, User } from '../../shared/schemas/user';

/** The invented demo scenario's people; every one signs in with DEMO_PASSWORD. */
export const DEMO_PASSWORD = 'crestline-demo';
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@crestline.example', name: 'Mira Kestrel', role: 'admin' },
  { email: 'engineer@crestline.example', name: 'Tomas Quill', role: 'engineer' },
  { email: 'fieldtech@crestline.example', name: 'Noor Halden', role: 'engineer' },
  { email: 'viewer@crestline.example', name: 'Ines Carrow', role: 'viewer' },
];
export const DEMO_PROJECT = 'Harbourside pumping station: power-quality survey';

/** Seeds the demo scenario once: a database that already has the demo users is left as it is. */
export async function seedDemo(ctx: AppContext): Promise<void> {
  if (await findUserByEmail(ctx.db, DEMO_USERS[0].email)) return;
  const hash = await bcrypt.hash(DEMO_PASSWORD, ctx.config.BCRYPT_COST);
  const ids: number[] = [];
  for (const u of DEMO_USERS) ids.push(await insertUser(ctx.db, { ...u, passwordHash: hash }));
  if ((await listProjects(ctx.db, 'all')).some((p) => p.name === DEMO_PROJECT)) return;
  const projectId = await insertProject(ctx.db, {
    name: DEMO_PROJECT,
    description: 'Commissioning survey of an invented pumping station: drives, UPS, lighting and the incoming supply.',
    createdBy: ids[1],
  });
  await addDemoCaptures(ctx, { id: ids[1], ...DEMO_USERS[1] }, projectId);
  await seedMeterProfiles(ctx.db, projectId, ids[1]);
}

/**
 * Files the invented demo captures (waveforms on which meters disagree) under a project, through the
 * same upload path as any file. A capture already uploaded elsewhere is recognised and not copied.
 */
export async function addDemoCaptures(ctx: AppContext, user: User, projectId: number): Promise<number> {
  const dir = path.join(ctx.config.DATA_DIR, 'uploads');
  await mkdir(dir, { recursive: true });
  let added = 0;
  for (const c of demoCaptures()) {
    const file = path.join(dir, `demo-${process.pid}-${c.file}`);
    const text = demoCsv(c);
    await writeFile(file, text);
    const r = await acceptUpload(ctx, user, { path: file, originalname: c.file, size: Buffer.byteLength(text) }, { name: c.name, projectId });
    if (!r.duplicate) {
      added++;
      await ctx.db.update(captures).set({ tags: c.tags }).where(eq(captures.id, r.id));
    }
  }
  return added;
}
