/**
 * A reason Crestline cannot start that the person starting it can act on (a port in use, another
 * instance on the same data folder, a bad setting). server/index.ts prints its message alone, without a
 * stack, and exits 1; any other error is a bug and keeps its stack.
 */
export class StartupError extends Error {
  override name = 'StartupError';
}

/**
 * Turns a failed listen into the one line that names the port and the variable that changes it.
 * Errors other than the usual three are returned unchanged.
 */
export function listenError(err: unknown, port: number, host: string, variable: string): unknown {
  const code = (err as NodeJS.ErrnoException).code;
  if (code === 'EADDRINUSE') return new StartupError(`Crestline cannot start: port ${port} on ${host} is already in use; set ${variable} to a free port.`);
  if (code === 'EACCES') return new StartupError(`Crestline cannot start: port ${port} on ${host} needs privileges this user lacks; set ${variable} to a port above 1023.`);
  if (code === 'EADDRNOTAVAIL') return new StartupError(`Crestline cannot start: ${host} is not an address of this machine; set HOST to one that is.`);
  return err;
}
