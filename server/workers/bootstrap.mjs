// Worker threads start here: register tsx so the TypeScript entry named in workerData can load.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
