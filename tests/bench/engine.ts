// The checklist engine in-process: evaluations per second for the demo
// techniques (already parsed, as the live editor and the register evaluate them).
import { Bench } from 'tinybench';
import { evaluateParsedTechnique } from '../../shared/domain/checklist';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

export interface EngineResult {
  name: string;
  perSecond: number;
  meanMicros: number;
  p99Micros: number;
}

export async function benchEngine(timeMs = 2_000): Promise<EngineResult[]> {
  const bench = new Bench({ time: timeMs, warmupTime: 500 });
  for (const technique of DEMO_TECHNIQUES) {
    bench.add(`${technique.code} (${technique.coils.map((coil) => coil.type).join('+')}, ${technique.part.form})`, () => {
      evaluateParsedTechnique(technique);
    });
  }
  await bench.run();
  return bench.tasks.map((task) => {
    const result = task.result as unknown as { throughput?: { mean: number }; latency?: { mean: number; p99?: number }; hz?: number; mean?: number; p99?: number };
    // tinybench 4+ reports throughput/latency objects (ms); older versions hz/mean/p99.
    const perSecond = result.throughput?.mean ?? result.hz ?? 0;
    const meanMs = result.latency?.mean ?? result.mean ?? 0;
    const p99Ms = result.latency?.p99 ?? result.p99 ?? 0;
    return { name: task.name, perSecond, meanMicros: meanMs * 1000, p99Micros: p99Ms * 1000 };
  });
}
