// npm run bench: seeds its own MariaDB with a realistic volume, starts Whorl and
// a bare node:http + mariadb baseline as child processes, loads both with
// autocannon on loopback (signed in for Whorl), times trail verification,
// benchmarks the checklist engine in-process, measures the client's initial
// JavaScript, and writes tests/bench/RESULTS.md. Everything it started is
// stopped and its database folder removed at the end, even on failure.
// BENCH_SECONDS (default 10) sets each load's duration; BENCH_PROFILE=1 writes a
// CPU profile of the Whorl process to tests/output/bench-profile/.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { closeSync, mkdirSync, openSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { findFreePort } from '../../server/db/local-mariadb';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { startAppProcess, stopAllAppProcesses } from '../faults/helpers/app-process';
import { ApiClient } from '../faults/helpers/http-client';
import { startBenchDatabase } from './bench-database';
import { BENCH_PASSWORD, seedBenchDatabase } from './seed';
import { benchEngine } from './engine';
import { measureBundles } from './bundle';
import { benchExtentAndImport, type TimedCall } from './extent-impact';

const ROOT = path.resolve(import.meta.dirname, '../..');
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 20;
const LIST_QUERY = 'state=action_open&sort=-number&page=3&pageSize=50';

interface LoadFigures {
  name: string;
  requestsPerSecond: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  non2xx: number;
  statuses: Record<string, number>;
  note?: string;
}

function sh(command: string): string {
  return spawnSync('sh', ['-c', command], { encoding: 'utf8' }).stdout.trim();
}

function machine() {
  return {
    nproc: sh('nproc'),
    memory: sh('free -g | sed -n 2p | awk \'{print $2 " GiB total, " $7 " GiB available"}\''),
    node: process.version,
    mariadb: sh('mariadbd --version 2>/dev/null || /usr/sbin/mariadbd --version').replace(/^.*Ver\s+/, ''),
    cpu: os.cpus()[0]?.model ?? 'unknown',
    load: os.loadavg().map((value) => value.toFixed(2)).join(' '),
  };
}

async function load(name: string, options: autocannon.Options, note?: string): Promise<LoadFigures> {
  // A short warm-up (JIT, pools, caches), then the measured run.
  await autocannon({ ...options, duration: 2 });
  const result = await autocannon({ connections: CONNECTIONS, duration: SECONDS, timeout: 10, ...options });
  const latency = result.latency as unknown as Record<string, number>;
  const figures: LoadFigures = {
    name,
    requestsPerSecond: result.requests.average,
    p50: latency.p50,
    p95: latency.p97_5 !== undefined && latency.p95 === undefined ? latency.p97_5 : (latency.p95 ?? latency.p97_5),
    p99: latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
    statuses: Object.fromEntries(Object.entries(result.statusCodeStats ?? {}).map(([code, stats]) => [code, stats.count ?? 0])),
    note,
  };
  console.log(`${name}: ${figures.requestsPerSecond.toFixed(0)} req/s, p50 ${figures.p50} ms, p95 ${figures.p95} ms, p99 ${figures.p99} ms, errors ${figures.errors}, non-2xx ${figures.non2xx}, statuses ${JSON.stringify(figures.statuses)}`);
  return figures;
}

/** One client, one request at a time: the latency without queueing (median of n). */
async function sequentialMedian(client: ApiClient | null, url: string, init: { method?: string; body?: unknown } = {}, n = 9): Promise<number> {
  const times: number[] = [];
  for (let i = 0; i < n; i += 1) {
    if (client) {
      const result = await client.call(init.method ?? 'GET', url.replace(client.baseUrl, ''), init.body, 60_000);
      if (result.status !== 200) throw new Error(`${url}: ${result.status}`);
      times.push(result.ms);
    } else {
      const started = performance.now();
      const response = await fetch(url);
      await response.arrayBuffer();
      times.push(performance.now() - started);
    }
  }
  return times.sort((a, b) => a - b)[Math.floor(n / 2)];
}

function startBaseline(databaseUrl: string, port: number): Promise<ChildProcess> {
  mkdirSync(path.join(ROOT, 'tests/output'), { recursive: true });
  const fd = openSync(path.join(ROOT, 'tests/output/bench-baseline.log'), 'w');
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'tests/bench/baseline-server.ts')], {
    cwd: ROOT,
    stdio: ['ignore', fd, fd],
    env: { PATH: process.env.PATH, DATABASE_URL: databaseUrl, PORT: String(port), DATABASE_POOL_MAX: '20' },
  });
  closeSync(fd);
  return (async () => {
    for (let i = 0; i < 150; i += 1) {
      try {
        const response = await fetch(`http://127.0.0.1:${port}/findings?pageSize=1`);
        await response.arrayBuffer();
        if (response.ok) return child;
      } catch {
        /* not up yet */
      }
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
    throw new Error('baseline server did not start; see tests/output/bench-baseline.log');
  })();
}

async function main() {
  const info = machine();
  console.log(`machine: ${info.nproc} cores (${info.cpu}), ${info.memory}, node ${info.node}, MariaDB ${info.mariadb}, load ${info.load}`);
  const database = await startBenchDatabase();
  let baseline: ChildProcess | undefined;
  try {
    const seed = await seedBenchDatabase(database.instance.url);
    const profileDir = path.join(ROOT, 'tests/output/bench-profile');
    const app = await startAppProcess({
      databaseUrl: database.instance.url,
      label: 'bench',
      env: { NODE_ENV: 'production', DATABASE_POOL_MAX: '20' },
      nodeArgs: process.env.BENCH_PROFILE === '1' ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : [],
    });
    const baselinePort = await findFreePort();
    baseline = await startBaseline(database.instance.url, baselinePort);

    const signedIn = async (email: string) => {
      const client = new ApiClient(app.url);
      await client.signIn(email, BENCH_PASSWORD);
      return client;
    };
    const [quality, owner, auditor, admin] = await Promise.all([
      signedIn(seed.users.quality),
      signedIn(seed.users.owner),
      signedIn(seed.users.auditor),
      signedIn(seed.users.admin),
    ]);
    const json = { 'content-type': 'application/json' };
    const results: LoadFigures[] = [];
    const sequential: Record<string, number> = {};
    const plan = database.instance.rootSql(
      "USE whorl_bench; EXPLAIN SELECT f.id FROM findings f LEFT JOIN corrective_actions ca ON ca.finding_id = f.id WHERE f.state = 'action_open' ORDER BY f.number DESC, f.id DESC LIMIT 50 OFFSET 100",
    );
    const hasFindings = seed.counts.findings !== undefined && (await quality.call('GET', '/api/findings?pageSize=1')).status === 200;

    if (hasFindings) {
      sequential['findings list (Whorl)'] = await sequentialMedian(quality, `${app.url}/api/findings?${LIST_QUERY}`);
      sequential['findings list (baseline)'] = await sequentialMedian(null, `http://127.0.0.1:${baselinePort}/findings?${LIST_QUERY}`);
      sequential["a finding's page (Whorl)"] = await sequentialMedian(quality, `${app.url}/api/findings/${seed.findingIds[777]}`);
      sequential['checklist evaluate (Whorl)'] = await sequentialMedian(auditor, `${app.url}/api/checklist/evaluate`, { method: 'POST', body: DEMO_TECHNIQUES[0] });
      console.log(`one request at a time (median ms): ${JSON.stringify(Object.fromEntries(Object.entries(sequential).map(([k, v]) => [k, Math.round(v)])))}`);
      const whorlList = await load('Whorl: findings list (state filter, sorted, page 3 of 50)', {
        url: `${app.url}/api/findings?${LIST_QUERY}`,
        headers: { cookie: quality.cookieHeader },
      });
      const baselineList = await load('Baseline: the same list (node:http + mariadb pool)', {
        url: `http://127.0.0.1:${baselinePort}/findings?${LIST_QUERY}`,
      });
      results.push(whorlList, baselineList);

      const ids = seed.findingIds;
      results.push(
        await load('Whorl: a finding\'s page (GET /api/findings/:id, random id)', {
          url: `${app.url}/api/findings/1`,
          headers: { cookie: quality.cookieHeader },
          requests: [{ method: 'GET', path: '/api/findings/1', setupRequest: (req) => ({ ...req, path: `/api/findings/${ids[Math.floor(Math.random() * ids.length)]}` }) }],
        }),
      );

      // The transition round trip: the owner asks for an extension, the quality manager rejects it,
      // each pair on an action no other connection is using at that moment.
      const free = [...seed.ownerActionIds];
      const versions = new Map<number, number>();
      for (const id of free) {
        const view = await quality.call('GET', `/api/actions/${id}`);
        versions.set(id, (view.body as { version: number }).version);
      }
      const later = new Date(Date.now() + 365 * 86_400_000).toISOString().slice(0, 10);
      type Pair = { id?: number };
      const remember = (status: number, body: string, context: object) => {
        if (status === 200) versions.set((context as Pair).id!, (JSON.parse(body) as { version: number }).version);
      };
      results.push(
        await load(
          'Whorl: transition round trip (REQUEST_EXTENSION by the owner + REJECT_EXTENSION by the quality manager)',
          {
            url: app.url,
            requests: [
              {
                method: 'POST',
                setupRequest: (req, context) => {
                  const id = free.shift()!;
                  (context as Pair).id = id;
                  return {
                    ...req,
                    path: `/api/actions/${id}/events`,
                    headers: { ...json, cookie: owner.cookieHeader, 'x-csrf-token': owner.csrfToken },
                    body: JSON.stringify({ type: 'REQUEST_EXTENSION', version: versions.get(id), dueDate: later, reason: 'Waiting for the replacement probe' }),
                  };
                },
                onResponse: remember,
              },
              {
                method: 'POST',
                setupRequest: (req, context) => ({
                  ...req,
                  path: `/api/actions/${(context as Pair).id}/events`,
                  headers: { ...json, cookie: quality.cookieHeader, 'x-csrf-token': quality.csrfToken },
                  body: JSON.stringify({ type: 'REJECT_EXTENSION', version: versions.get((context as Pair).id!), reason: 'The due date stands' }),
                }),
                onResponse: (status, body, context) => {
                  remember(status, body, context);
                  free.push((context as Pair).id!);
                },
              },
            ],
          },
          'each request of the pair counted; one round trip = 2 requests, 2 transactions, 2 trail entries',
        ),
      );
    } else {
      console.log('findings are not there yet: list, page and transition benchmarks skipped');
    }

    const evaluate = await auditor.call('POST', '/api/checklist/evaluate', DEMO_TECHNIQUES[0]);
    if (evaluate.status === 200) {
      results.push(
        await load('Whorl: POST /api/checklist/evaluate (wheel bead-seat technique)', {
          url: `${app.url}/api/checklist/evaluate`,
          method: 'POST',
          headers: { ...json, cookie: auditor.cookieHeader, 'x-csrf-token': auditor.csrfToken },
          body: JSON.stringify(DEMO_TECHNIQUES[0]),
        }),
      );
    } else {
      console.log(`POST /api/checklist/evaluate answered ${evaluate.status}: skipped`);
    }

    // Trail verification is a long single request: timed three times, one at a time.
    const verifications: { ms: number; entries: number; ok: boolean }[] = [];
    for (let i = 0; i < 3; i += 1) {
      const result = await admin.call('GET', '/api/trail/verify', undefined, 120_000);
      const body = result.body as { ok: boolean; entries: number };
      verifications.push({ ms: result.ms, entries: body.entries, ok: body.ok && result.status === 200 });
    }
    console.log(`trail verify: ${verifications.map((v) => `${Math.round(v.ms)} ms (${v.entries} entries, ok ${v.ok})`).join(', ')}`);

    // Last of the HTTP work: it adds findings, runs and inspections the loads above should not see.
    const auditorSession = (await auditor.call('GET', '/api/session')).body as { user: { id: number } };
    const extentImpact = await benchExtentAndImport(seed, { auditor, quality, auditorId: auditorSession.user.id });
    for (const call of extentImpact) console.log(`${call.name}: ${call.ms.map((ms) => Math.round(ms)).join(', ')} ms (${call.detail})`);

    await app.stop();
    baseline.kill('SIGTERM');
    baseline = undefined;

    const engine = await benchEngine();
    for (const task of engine) console.log(`engine ${task.name}: ${Math.round(task.perSecond)} evaluations/s (mean ${task.meanMicros.toFixed(1)} µs)`);
    const bundles = await measureBundles();
    console.log(`initial JS (gzip): sign-in ${(bundles.signIn.gzipBytes / 1024).toFixed(1)} kB, largest route ${bundles.largest.route} ${(bundles.largest.gzipBytes / 1024).toFixed(1)} kB`);

    writeResults({ info, seed, results, verifications, engine, bundles, sequential, plan, extentImpact, loadAtEnd: os.loadavg().map((v) => v.toFixed(2)).join(' ') });
  } finally {
    baseline?.kill('SIGTERM');
    await stopAllAppProcesses();
    await database.stop();
  }
}

function writeResults({
  info,
  seed,
  results,
  verifications,
  engine,
  bundles,
  sequential,
  plan,
  extentImpact,
  loadAtEnd,
}: {
  sequential: Record<string, number>;
  extentImpact: TimedCall[];
  plan: string;
  loadAtEnd: string;
  info: ReturnType<typeof machine>;
  seed: Awaited<ReturnType<typeof seedBenchDatabase>>;
  results: LoadFigures[];
  verifications: { ms: number; entries: number; ok: boolean }[];
  engine: Awaited<ReturnType<typeof benchEngine>>;
  bundles: Awaited<ReturnType<typeof measureBundles>>;
}) {
  const whorlList = results.find((r) => r.name.startsWith('Whorl: findings list'));
  const baselineList = results.find((r) => r.name.startsWith('Baseline'));
  const ratio = whorlList && baselineList && baselineList.requestsPerSecond > 0 ? whorlList.requestsPerSecond / baselineList.requestsPerSecond : null;
  const reads = results.filter((r) => r.name.startsWith('Whorl') && !r.name.includes('transition'));
  const verifyMedian = [...verifications].sort((a, b) => a.ms - b.ms)[1];
  const typical = engine[0];
  const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;
  const verdict = (ok: boolean) => (ok ? 'met' : '**missed**');
  const lines = [
    '# Benchmark results',
    '',
    `Produced by \`npm run bench\` (tests/bench/run.ts) on ${new Date().toISOString()}; each load ${SECONDS} s after a 2 s warm-up, ${CONNECTIONS} connections, autocannon on loopback.`,
    '',
    `Machine: ${info.nproc} cores (${info.cpu}); memory ${info.memory}; Node ${info.node}; MariaDB ${info.mariadb}; load average at the start ${info.load}${Number(info.load.split(' ')[0]) > Number(info.nproc) ? ' (other work was running on the machine)' : ''}.`,
    '',
    `Seeded in **${seed.seconds.toFixed(1)} s**: ${Object.entries(seed.counts).map(([k, v]) => `${v.toLocaleString('en')} ${k}`).join(', ')}${seed.skipped.length ? `; not seeded (table missing): ${seed.skipped.join(', ')}` : ''}.`,
    '',
    '## HTTP under load',
    '',
    '| scenario | req/s | p50 ms | p95 ms | p99 ms | errors | non-2xx |',
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: |',
    ...results.map((r) => `| ${r.name}${r.note ? ` (${r.note})` : ''} | ${r.requestsPerSecond.toFixed(0)} | ${r.p50} | ${r.p95} | ${r.p99} | ${r.errors} | ${r.non2xx} |`),
    '',
    `Load average at the end: ${loadAtEnd}.`,
    '',
    'One request at a time (one client, median of 9, no queueing):',
    '',
    ...Object.entries(sequential).map(([name, ms]) => `- ${name}: ${ms.toFixed(0)} ms`),
    '',
    'Plan of the list query (EXPLAIN; the same for Whorl and the baseline):',
    '',
    '```',
    plan.trim(),
    '```',
    '',
    ratio !== null ? `Whorl/baseline throughput on the list: **${ratio.toFixed(2)}×**.` : 'Whorl/baseline: findings list not available yet.',
    '',
    `Trail verification of ${verifyMedian?.entries.toLocaleString('en')} entries: ${verifications.map((v) => `${Math.round(v.ms)} ms`).join(', ')} (median ${Math.round(verifyMedian?.ms ?? 0)} ms), chain ok: ${verifications.every((v) => v.ok)}.`,
    '',
    '## Extent of condition, impact worksheet and CSV import (one request at a time)',
    '',
    ...(extentImpact.length
      ? [
          '| request | ms (each run) | what it did |',
          '| --- | --- | --- |',
          ...extentImpact.map((call) => `| ${call.name} | ${call.ms.map((ms) => Math.round(ms)).join(', ')} | ${call.detail} |`),
        ]
      : ['Not measured: the inspections table or a failing approved technique is not in the seed.']),
    '',
    '## Checklist engine (in-process, tinybench, parsed techniques)',
    '',
    '| technique | evaluations/s | mean µs | p99 µs |',
    '| --- | ---: | ---: | ---: |',
    ...engine.map((task) => `| ${task.name} | ${Math.round(task.perSecond).toLocaleString('en')} | ${task.meanMicros.toFixed(1)} | ${task.p99Micros.toFixed(1)} |`),
    '',
    '## Client: initial JavaScript per route (gzip, entry + layout + route chunks and their static imports)',
    '',
    '| route | chunks | gzip |',
    '| --- | ---: | ---: |',
    ...bundles.routes.map((route) => `| ${route.route} | ${route.files} | ${kb(route.gzipBytes)} |`),
    '',
    '## Targets',
    '',
    '| target | measured | |',
    '| --- | --- | --- |',
    `| list throughput ≥ 0.5× baseline | ${ratio === null ? 'n/a' : `${ratio.toFixed(2)}×`} | ${ratio === null ? 'not measured' : verdict(ratio >= 0.5)} |`,
    `| p99 < 100 ms at 20 connections for reads | ${reads.map((r) => `${r.p99} ms`).join(', ')} | ${verdict(reads.every((r) => r.p99 < 100))} |`,
    `| zero errors and zero non-2xx | ${results.reduce((sum, r) => sum + r.errors, 0)} errors, ${results.reduce((sum, r) => sum + r.non2xx, 0)} non-2xx | ${verdict(results.every((r) => r.errors === 0 && r.non2xx === 0))} |`,
    `| engine ≥ 50,000 evaluations/s (typical technique) | ${Math.round(typical.perSecond).toLocaleString('en')}/s (${typical.name}) | ${verdict(typical.perSecond >= 50_000)} |`,
    `| sign-in route < 150 kB gzip of JS | ${kb(bundles.signIn.gzipBytes)} (largest: ${bundles.largest.route}, ${kb(bundles.largest.gzipBytes)}) | ${verdict(bundles.signIn.gzipBytes < 150 * 1024)} |`,
    `| trail verification of 300,000 entries < 5 s | ${Math.round(verifyMedian?.ms ?? 0)} ms | ${verdict((verifyMedian?.ms ?? Infinity) < 5_000)} |`,
    '| SQL queries per list request constant in the page size | tests/server/list-query-count.test.ts (npm test) | see the test |',
    '',
  ];
  const file = path.join(ROOT, process.env.BENCH_RESULTS_FILE ?? 'tests/bench/RESULTS.md');
  const analysisMarker = '<!-- analysis -->';
  let analysis = '';
  try {
    const previous = (spawnSync('cat', [file], { encoding: 'utf8' }).stdout ?? '') as string;
    const at = previous.indexOf(analysisMarker);
    if (at >= 0) analysis = previous.slice(at);
  } catch {
    /* first run */
  }
  writeFileSync(file, lines.join('\n') + '\n' + (analysis || `${analysisMarker}\n## Analysis\n\n(written by hand below this line; kept across runs)\n`));
  console.log(`wrote ${path.relative(ROOT, file)}`);
}

main().catch((error) => {
  console.error(error);
  process.exitCode = 1;
});
