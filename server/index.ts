import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './db/seed';
import { startServer } from './server';

const running = await startServer();
if (running.ctx.config.SEED_DEMO) {
  await seedDemo(running.ctx);
  running.processor.nudge();
}
console.log(`\n  Crestline is ready: ${running.url}`);
if (running.ctx.config.SEED_DEMO) {
  console.log(`  Demo sign-in: ${DEMO_USERS[1].email} / ${DEMO_PASSWORD}`);
  console.log(`  (also ${DEMO_USERS[0].email} as admin and ${DEMO_USERS[3].email} as viewer, same password)`);
}
console.log('  Ctrl-C stops the server; data stays in .data/.\n');

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`${signal}: stopping Crestline...`);
  await running.stop();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
