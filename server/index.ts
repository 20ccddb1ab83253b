import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './db/seed';
import { startServer, type RunningServer } from './server';
import { StartupError } from './startupError';

/** A stop that takes longer (a stuck query, a huge capture mid-analysis) ends the process anyway; the job queue takes the capture up again. */
const STOP_LIMIT_MS = 30_000;

// Once the terminal is closed, writing to it fails (EIO); that must not end a server that is stopping.
for (const stream of [process.stdout, process.stderr]) stream.on('error', () => undefined);

let running: RunningServer;
try {
  running = await startServer();
} catch (err) {
  if (!(err instanceof StartupError)) throw err;
  // Something the person starting Crestline can fix: its message says what, and a stack would bury it.
  console.error(err.message);
  process.exit(1);
}

let stopping = false;
async function shutdown(signal: string) {
  // A Ctrl-C reaches the server twice under `npm start` (from the terminal and from scripts/start.sh),
  // and people press it again while waiting: the first one stops, later ones change nothing.
  if (stopping) return;
  stopping = true;
  console.log(`${signal}: stopping Crestline...`);
  setTimeout(() => {
    console.error(`Crestline did not stop within ${STOP_LIMIT_MS / 1000} s; exiting anyway.`);
    process.exit(1);
  }, STOP_LIMIT_MS).unref();
  await running.stop();
  console.log('Crestline stopped.');
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
// A closed terminal: stop as cleanly as on Ctrl-C rather than die where the server stands.
process.on('SIGHUP', () => void shutdown('SIGHUP'));

const config = running.ctx.config;
if (config.SEED_DEMO) {
  try {
    await seedDemo(running.ctx);
    running.processor.nudge();
  } catch (err) {
    // A stop during seeding closes the pool under it: no failure, and shutdown() ends the process.
    if (!stopping) {
      console.error('Seeding the demo failed:', err);
      await running.stop();
      process.exit(1);
    }
  }
}
if (!stopping && !config.RUN_HTTP) {
  console.log(`\n  Crestline worker is running (no HTTP): it processes captures from the shared queue. Ctrl-C stops it.\n`);
} else if (!stopping) {
  console.log(`\n  Crestline is ready: ${running.url}`);
  if (config.SEED_DEMO) {
    console.log(`  Demo sign-in: ${DEMO_USERS[1].email} / ${DEMO_PASSWORD}`);
    console.log(`  (also ${DEMO_USERS[0].email} as admin and ${DEMO_USERS[3].email} as viewer, same password)`);
  }
  console.log(`  Ctrl-C stops the server; data stays in ${config.DATA_DIR}/.\n`);
}
