import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// Spawns the real command (tsx scripts/analyse-pod.ts), as `npm run analyse-pod` does.
const root = fileURLToPath(new URL('../../..', import.meta.url));
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const script = path.join(root, 'scripts', 'analyse-pod.ts');

function run(args: string[]) {
  const result = spawnSync(tsx, [script, ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

let dir: string;
const file = (name: string) => path.join(dir, name);

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'whorl-analyse-pod-'));
  const hitMiss = [[0.3, 'miss'], [0.4, 'no'], [0.5, '0'], [0.6, 'hit'], [0.7, '0'], [0.8, 'yes'], [0.9, '1'], [1.0, '0'], [1.2, 'hit'], [1.5, '1'], [2.0, '1'], [2.5, 'yes']];
  writeFileSync(file('hit-miss.csv'), `\uFEFFSize_mm,Hit\n${hitMiss.map(([a, h]) => `${a},${h}`).join('\n')}\n`);
  const signal = [[0.3, 0.2], [0.4, 0.5], [0.5, 0.45], [0.7, 0.9], [0.9, 1.1], [1.2, 1.9], [1.5, 2.1], [2.0, 3.5], [2.5, 3.9], [3.0, 6.5]];
  writeFileSync(file('signal.csv'), `size_mm,signal\n${signal.map(([a, s]) => `${a},${s}`).join('\n')}\n`);
  writeFileSync(file('noise.csv'), 'signal\n0.1\n0.15\n0.2\n0.12\n0.3\n');
  writeFileSync(file('separated.csv'), 'size_mm,hit\n0.3,0\n0.4,0\n1.0,1\n1.2,1\n');
  writeFileSync(file('bad-hit.csv'), 'size_mm,hit\n0.3,0\n0.4,maybe\n');
  writeFileSync(file('no-outcome.csv'), 'size_mm,depth\n0.3,1\n');
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Each run starts tsx (about a second, more on a busy machine), so the tests get a longer timeout.
describe('npm run analyse-pod', { timeout: 90_000 }, () => {
  it('when given hit/miss data, then it exits 0 and prints the model, a50, a90 and both a90/95 bounds', () => {
    const { status, stdout } = run([file('hit-miss.csv'), '--link', 'probit']);
    expect(status).toBe(0);
    const json = JSON.parse(stdout);
    expect(json).toMatchObject({ model: 'hit-miss', link: 'probit', n: 12 });
    for (const key of ['a50Mm', 'a90Mm', 'a9095Mm', 'a9095WaldMm', 'parameters', 'convergence']) expect(json).toHaveProperty(key);
    expect(json.convergence.converged).toBe(true);
    expect(json.a9095WaldMm).toBeGreaterThan(json.a90Mm);
  });

  it('when given signal data with thresholds and noise, then it exits 0 with the delta-method bound and false calls', () => {
    const { status, stdout } = run([file('signal.csv'), '--decision-threshold', '0.6', '--recording-threshold=0.25', '--saturation', '10', '--noise', file('noise.csv')]);
    expect(status).toBe(0);
    const json = JSON.parse(stdout);
    expect(json).toMatchObject({ model: 'signal-response', n: 10, censoredBelow: 1, decisionThreshold: 0.6 });
    for (const key of ['a50Mm', 'a90Mm', 'a9095Mm', 'parameters', 'convergence', 'falseCalls', 'tradeOff']) expect(json).toHaveProperty(key);
    expect(json.a9095Mm).toBeGreaterThan(json.a90Mm);
  });

  it('when the data are separated, then it exits 2 with the reason', () => {
    const { status, stdout, stderr } = run([file('separated.csv')]);
    expect(status).toBe(2);
    expect(JSON.parse(stdout)).toMatchObject({ ok: false, code: 'complete_separation' });
    expect(stderr).toMatch(/smaller than every hit/);
  });

  it('when the input is unusable, then it exits 2 naming the row or the missing column or option', () => {
    expect(run([file('bad-hit.csv')])).toMatchObject({ status: 2, stderr: expect.stringMatching(/row 3: hit must be/) });
    expect(run([file('no-outcome.csv')])).toMatchObject({ status: 2, stderr: expect.stringMatching(/hit column .* or a signal column/) });
    expect(run([file('signal.csv')])).toMatchObject({ status: 2, stderr: expect.stringMatching(/--decision-threshold/) });
    expect(run([file('hit-miss.csv'), '--link', 'cloglog'])).toMatchObject({ status: 2, stderr: expect.stringMatching(/logit or probit/) });
    expect(run([file('missing.csv')])).toMatchObject({ status: 2, stderr: expect.stringMatching(/cannot read/) });
  });
});
