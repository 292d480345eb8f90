/** MariaDB/InnoDB deadlock (1213) and lock-wait timeout (1205): the transaction was rolled back and can run again. */
function isRetryable(err: unknown): boolean {
  const e = err as { errno?: number; driverError?: { errno?: number } };
  const errno = e?.errno ?? e?.driverError?.errno;
  return errno === 1213 || errno === 1205;
}

/** Run a whole transaction again (a few times, with jitter) when InnoDB chose it as a deadlock victim. */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await work();
    } catch (err) {
      if (i >= attempts || !isRetryable(err)) throw err;
      await new Promise((r) => setTimeout(r, 5 + Math.random() * 20 * i));
    }
  }
}
