/**
 * InnoDB may pick a transaction (or a lone statement) as a deadlock victim; it is then safe to run it
 * again. Runs `fn` up to `tries` times while it fails with ER_LOCK_DEADLOCK (1213).
 */
export async function retryOnDeadlock<T>(fn: () => Promise<T>, tries = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await fn();
    } catch (err) {
      const code = (err as { cause?: { errno?: number } }).cause?.errno ?? (err as { errno?: number }).errno;
      if (code !== 1213 || i >= tries) throw err;
    }
  }
}
