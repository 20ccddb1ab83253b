import bcrypt from 'bcryptjs';
import type { AppContext } from '../context';
import { findUserByEmail, insertUser } from './userRepository';
import { insertProject, listProjects } from './projectRepository';
import type { Role } from '../../shared/schemas/user';

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
  if (!(await listProjects(ctx.db, 'all')).some((p) => p.name === DEMO_PROJECT)) {
    await insertProject(ctx.db, {
      name: DEMO_PROJECT,
      description: 'Commissioning survey of an invented pumping station: drives, UPS, lighting and the incoming supply.',
      createdBy: ids[1],
    });
  }
}
