// A bounded write load: a few workers calling one request factory in a loop
// until told to stop, keeping every answer (status, time, what was acknowledged).
import type { CallResult } from './http-client';

export interface LoadRecord<T> extends CallResult {
  at: number; // ms since the load started
  input: T;
}

export interface RunningLoad<T> {
  records: LoadRecord<T>[];
  stop(): Promise<LoadRecord<T>[]>;
  /** Resolves when a 2xx answer arrives after `since` (ms on the load's clock), or rejects after timeoutMs. */
  waitForSuccessAfter(since: number, timeoutMs: number): Promise<number>;
  elapsed(): number;
}

export function startLoad<T>(workers: number, next: (n: number) => T, send: (input: T) => Promise<CallResult>, pauseMs = 20): RunningLoad<T> {
  const records: LoadRecord<T>[] = [];
  const started = performance.now();
  const elapsed = () => performance.now() - started;
  let stopping = false;
  let counter = 0;
  const loops = Array.from({ length: workers }, async () => {
    while (!stopping) {
      const input = next((counter += 1));
      const at = elapsed();
      const result = await send(input);
      records.push({ ...result, at, input });
      await new Promise((resolve) => setTimeout(resolve, pauseMs));
    }
  });
  return {
    records,
    elapsed,
    async stop() {
      stopping = true;
      await Promise.all(loops);
      return records;
    },
    async waitForSuccessAfter(since, timeoutMs) {
      const deadline = elapsed() + timeoutMs;
      for (;;) {
        const hit = records.find((record) => record.at >= since && record.status >= 200 && record.status < 300);
        if (hit) return hit.at + hit.ms;
        if (elapsed() > deadline) throw new Error(`no 2xx answer within ${timeoutMs} ms after ${Math.round(since)} ms`);
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    },
  };
}
