import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// Spawns the real command (tsx scripts/check-technique.ts), as `npm run check-technique` does.
const root = fileURLToPath(new URL('../..', import.meta.url));
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const script = path.join(root, 'scripts', 'check-technique.ts');
const fixtures = path.join(root, 'tests', 'shared', 'fixtures');
const conforming = path.join(fixtures, 'wheel-bead-seat.json');
const failing = path.join(fixtures, 'heat-exchanger-bobbin.json');

function run(args: string[], input?: string) {
  const result = spawnSync(tsx, [script, ...args], { cwd: root, input, encoding: 'utf8', timeout: 30_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

let dir: string;
let invalid: string;
let badJson: string;
let folder: string;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'whorl-check-technique-'));
  invalid = path.join(dir, 'invalid.json');
  writeFileSync(invalid, JSON.stringify({ code: 'X', title: 'Bad', revision: 'A', material: { name: 'brass', conductivityIacs: 'high' } }));
  badJson = path.join(dir, 'bad.json');
  writeFileSync(badJson, '{ "code": ');
  folder = path.join(dir, 'folder');
  mkdirSync(folder);
  copyFileSync(conforming, path.join(folder, 'a.json'));
  copyFileSync(failing, path.join(folder, 'b.json'));
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Each run starts tsx (about a second), so the tests get a longer timeout.
describe('check-technique command line', { timeout: 30_000 }, () => {
  it('prints the checklist and exits 0 for a conforming technique', () => {
    const { status, stdout } = run([conforming]);
    expect(status).toBe(0);
    const output = JSON.parse(stdout);
    expect(output).toMatchObject({ code: 'TAC-ET-004', verdict: 'conforms' });
    expect(output.results.length).toBeGreaterThan(5);
  });

  it('exits 1 for a technique that does not conform', () => {
    const { status, stdout } = run([failing]);
    expect(status).toBe(1);
    expect(JSON.parse(stdout).verdict).toBe('does-not-conform');
  });

  it('reads stdin for "-"', () => {
    const { status, stdout } = run(['-'], readFileSync(conforming, 'utf8'));
    expect(status).toBe(0);
    expect(JSON.parse(stdout).code).toBe('TAC-ET-004');
  });

  it('exits 2 on invalid input, naming the field on stderr', () => {
    const { status, stdout, stderr } = run([invalid]);
    expect(status).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/material\.conductivityIacs: conductivityIacs \(conductivity\) must be a finite number/);
    expect(stderr).toMatch(/part: part is required/);
  });

  it('exits 2 on bad JSON and on a missing file', () => {
    const bad = run([badJson]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/not valid JSON/);
    const missing = run([path.join(dir, 'nope.json')]);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/no such file/);
  });

  it('checks several files or a folder, printing an array and exiting 1 when any fails', () => {
    const files = run([conforming, failing]);
    expect(files.status).toBe(1);
    expect(JSON.parse(files.stdout).map((entry: { verdict: string }) => entry.verdict)).toEqual(['conforms', 'does-not-conform']);
    const both = run([folder]);
    expect(both.status).toBe(1);
    expect(JSON.parse(both.stdout).map((entry: { file: string }) => path.basename(entry.file))).toEqual(['a.json', 'b.json']);
    expect(run([conforming, conforming]).status).toBe(0);
  });

  it('exits 2 when any of several files is invalid, still printing the others', () => {
    const { status, stdout } = run([conforming, invalid]);
    expect(status).toBe(2);
    const printed = JSON.parse(stdout);
    expect(printed[0].verdict).toBe('conforms');
    expect(printed[1].issues[0].path).toBe('material.conductivityIacs');
  });

  it('applies an organisation policy file', () => {
    const policy = path.join(dir, 'policy.json');
    writeFileSync(policy, JSON.stringify({ edgeZoneShieldedDiameters: 1 }));
    // The wheel example's 5 mm shielded coil then has a 5 mm edge zone, but its guide and edge notch still hold.
    expect(run(['--policy', policy, conforming]).status).toBe(0);
    writeFileSync(policy, JSON.stringify({ scanIndexFractionMax: 0.2 }));
    expect(run(['--policy', policy, conforming]).status).toBe(1);
    writeFileSync(policy, JSON.stringify({ scanIndex: 0.2 }));
    const bad = run(['--policy', policy, conforming]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/Unknown policy setting "scanIndex"/);
  });

  it('exits 2 with usage when no file is given', () => {
    const { status, stderr } = run([]);
    expect(status).toBe(2);
    expect(stderr).toMatch(/Usage/);
  });
});
