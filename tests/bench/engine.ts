// The checklist engine in-process: evaluations per second for the demo techniques
// (already parsed, as the live editor and the register evaluate them), and the cold
// first evaluation after the coil field caches are emptied (a coil geometry the editor
// has not met yet).
import { Bench } from 'tinybench';
import { evaluateParsedTechnique } from '../../shared/domain/checklist';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

export interface EngineResult {
  name: string;
  perSecond: number;
  meanMicros: number;
  p99Micros: number;
  /** Median of repeated evaluations, µs (the figure the editor's 30 ms budget is about). */
  medianMicros?: number;
  /** First evaluation with a coil geometry not met before (fresh field grids and layer solutions), µs. */
  coldMicros?: number;
}

function techniqueName(technique: (typeof DEMO_TECHNIQUES)[number]): string {
  return `${technique.code} (${technique.coils.map((coil) => coil.type).join('+')}, ${technique.part.form})`;
}

/** A first evaluation with a coil geometry the caches have not seen (lift-off nudged by a different amount each call). */
export function coldEvaluationMicros(technique: (typeof DEMO_TECHNIQUES)[number], nudge: number): number {
  const fresh = { ...technique, coils: technique.coils.map((coil) => ({ ...coil, liftOffMm: 0.1 + nudge * 1e-6 })) };
  const start = performance.now();
  evaluateParsedTechnique(fresh);
  return (performance.now() - start) * 1000;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

export async function benchEngine(timeMs = 2_000): Promise<EngineResult[]> {
  const bench = new Bench({ time: timeMs, warmupTime: 500 });
  for (const technique of DEMO_TECHNIQUES) {
    bench.add(techniqueName(technique), () => {
      evaluateParsedTechnique(technique);
    });
  }
  await bench.run();
  return bench.tasks.map((task, index) => {
    const result = task.result as unknown as { throughput?: { mean: number }; latency?: { mean: number; p99?: number; p50?: number }; hz?: number; mean?: number; p99?: number };
    // tinybench 4+ reports throughput/latency objects (ms); older versions hz/mean/p99.
    const perSecond = result.throughput?.mean ?? result.hz ?? 0;
    const meanMs = result.latency?.mean ?? result.mean ?? 0;
    const p99Ms = result.latency?.p99 ?? result.p99 ?? 0;
    const technique = DEMO_TECHNIQUES[index];
    const colds = Array.from({ length: 5 }, (_, run) => coldEvaluationMicros(technique, run + 1));
    return {
      name: task.name,
      perSecond,
      meanMicros: meanMs * 1000,
      p99Micros: p99Ms * 1000,
      medianMicros: result.latency?.p50 !== undefined ? result.latency.p50 * 1000 : undefined,
      coldMicros: median(colds),
    };
  });
}

// Run alone: `npx tsx tests/bench/engine.ts` prints the engine's figures without the rest of the bench.
if (import.meta.url === `file://${process.argv[1]}`) {
  benchEngine(1_000).then((results) => {
    for (const result of results) {
      console.log(`${result.name}: median ${((result.medianMicros ?? result.meanMicros) / 1000).toFixed(2)} ms, mean ${(result.meanMicros / 1000).toFixed(2)} ms, p99 ${(result.p99Micros / 1000).toFixed(2)} ms, cold ${((result.coldMicros ?? 0) / 1000).toFixed(1)} ms`);
    }
  });
}
