// Retries a whole transaction when MariaDB picked it as a deadlock victim (it
// was rolled back, so running it again is safe). Rare: counters and chain
// heads are locked in one order everywhere.
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await work();
    } catch (error) {
      const code = (error as { original?: { code?: string }; parent?: { code?: string } }).original?.code;
      if (attempt >= attempts || (code !== 'ER_LOCK_DEADLOCK' && code !== 'ER_LOCK_WAIT_TIMEOUT')) throw error;
      await new Promise((resolve) => setTimeout(resolve, 10 * attempt + Math.random() * 20));
    }
  }
}
