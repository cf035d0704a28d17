// Runs the checklist engine over technique files from the command line.
//
//   npm run check-technique -- FILE.json            one technique: prints its checklist JSON
//   npm run check-technique -- -                    reads the technique from stdin
//   npm run check-technique -- A.json B.json DIR/   several (a folder means its *.json files): prints an array
//   options: --policy POLICY.json (organisation policy settings), --help
//
// Exit status: 0 every technique conforms; 1 at least one does not; 2 invalid input,
// unreadable file or bad JSON (the reason on stderr, naming the field).
import { readFile, readdir, stat } from 'node:fs/promises';
import path from 'node:path';
import { formatIssues, safeEvaluateTechnique, type ChecklistOutput, type TechniqueIssue } from '../shared/domain/checklist/index';
import { PolicyOverrideSchema } from '../shared/domain/policy';

const USAGE = `Usage: npm run check-technique -- [--policy POLICY.json] FILE.json|DIR|- [more files]
Prints the checklist as JSON. Exit status: 0 conforms, 1 does not conform, 2 invalid input.`;

const EXIT_CONFORMS = 0;
const EXIT_DOES_NOT_CONFORM = 1;
const EXIT_INVALID = 2;

type Outcome =
  | { source: string; kind: 'output'; output: ChecklistOutput }
  | { source: string; kind: 'invalid'; issues: TechniqueIssue[] }
  | { source: string; kind: 'unreadable'; reason: string };

/** A mistake in how the command was called: the usage text follows the message. */
class UsageError extends Error {}
/** An options file that cannot be used: the message says why. */
class InputError extends Error {}

interface Arguments {
  sources: string[];
  policyFile?: string;
}

function parseArguments(argv: string[]): Arguments | 'help' {
  const sources: string[] = [];
  let policyFile: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--help' || arg === '-h') return 'help';
    if (arg === '--policy') {
      policyFile = argv[++i];
      if (!policyFile) throw new UsageError('--policy needs a file name');
    } else if (arg.startsWith('--policy=')) {
      policyFile = arg.slice('--policy='.length);
    } else if (arg.startsWith('-') && arg !== '-') {
      throw new UsageError(`unknown option ${arg}`);
    } else {
      sources.push(arg);
    }
  }
  if (sources.length === 0) throw new UsageError('no technique file given');
  return { sources, policyFile };
}

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

/** Expands folders into their .json files (sorted), keeps files and "-" as given. */
async function expandSources(sources: string[]): Promise<{ files: string[]; unreadable: Outcome[]; folders: number }> {
  let folders = 0;
  const files: string[] = [];
  const unreadable: Outcome[] = [];
  for (const source of sources) {
    if (source === '-') {
      files.push(source);
      continue;
    }
    try {
      const info = await stat(source);
      if (info.isDirectory()) {
        folders++;
        const entries = (await readdir(source)).filter((name) => name.toLowerCase().endsWith('.json')).sort();
        if (entries.length === 0) unreadable.push({ source, kind: 'unreadable', reason: 'folder holds no .json files' });
        files.push(...entries.map((name) => path.join(source, name)));
      } else {
        files.push(source);
      }
    } catch (error) {
      unreadable.push({ source, kind: 'unreadable', reason: describeError(error) });
    }
  }
  return { files, unreadable, folders };
}

function describeError(error: unknown): string {
  if (error && typeof error === 'object' && 'code' in error && error.code === 'ENOENT') return 'no such file';
  if (error && typeof error === 'object' && 'code' in error && error.code === 'EACCES') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}

async function readJson(source: string): Promise<{ ok: true; value: unknown } | { ok: false; reason: string }> {
  let text: string;
  try {
    text = source === '-' ? await readStdin() : await readFile(source, 'utf8');
  } catch (error) {
    return { ok: false, reason: `cannot read: ${describeError(error)}` };
  }
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (error) {
    return { ok: false, reason: `not valid JSON: ${error instanceof Error ? error.message : String(error)}` };
  }
}

async function loadPolicy(policyFile: string | undefined): Promise<unknown> {
  if (!policyFile) return undefined;
  const json = await readJson(policyFile);
  if (!json.ok) throw new InputError(`${policyFile}: ${json.reason}`);
  const parsed = PolicyOverrideSchema.safeParse(json.value);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(policy)'}: ${issue.message}`);
    throw new InputError(`${policyFile}: invalid policy\n  ${lines.join('\n  ')}`);
  }
  return parsed.data;
}

async function checkSource(source: string, policy: unknown): Promise<Outcome> {
  const json = await readJson(source);
  if (!json.ok) return { source, kind: 'unreadable', reason: json.reason };
  const result = safeEvaluateTechnique(json.value, { policy });
  return result.success ? { source, kind: 'output', output: result.output } : { source, kind: 'invalid', issues: result.issues };
}

function sourceName(source: string): string {
  return source === '-' ? '(stdin)' : source;
}

function reportProblems(outcomes: Outcome[]): void {
  for (const outcome of outcomes) {
    if (outcome.kind === 'unreadable') process.stderr.write(`${sourceName(outcome.source)}: ${outcome.reason}\n`);
    if (outcome.kind === 'invalid') {
      process.stderr.write(`${sourceName(outcome.source)}: invalid technique\n`);
      for (const line of formatIssues(outcome.issues)) process.stderr.write(`  ${line}\n`);
    }
  }
}

function exitCode(outcomes: Outcome[]): number {
  if (outcomes.some((outcome) => outcome.kind !== 'output')) return EXIT_INVALID;
  const fails = outcomes.some((outcome) => outcome.kind === 'output' && outcome.output.verdict === 'does-not-conform');
  return fails ? EXIT_DOES_NOT_CONFORM : EXIT_CONFORMS;
}

async function main(argv: string[]): Promise<number> {
  const args = parseArguments(argv);
  if (args === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return EXIT_CONFORMS;
  }
  const policy = await loadPolicy(args.policyFile);
  const { files, unreadable, folders } = await expandSources(args.sources);
  const outcomes: Outcome[] = [...unreadable];
  for (const file of files) outcomes.push(await checkSource(file, policy));

  // One technique named on its own prints its checklist; several (or a folder) print an array.
  const single = args.sources.length === 1 && folders === 0;
  reportProblems(outcomes);
  if (single) {
    const [outcome] = outcomes;
    if (outcome.kind === 'output') process.stdout.write(`${JSON.stringify(outcome.output, null, 2)}\n`);
  } else {
    const printed = outcomes.map((outcome) =>
      outcome.kind === 'output'
        ? { file: sourceName(outcome.source), ...outcome.output }
        : outcome.kind === 'invalid'
          ? { file: sourceName(outcome.source), error: 'invalid technique', issues: outcome.issues }
          : { file: sourceName(outcome.source), error: outcome.reason },
    );
    process.stdout.write(`${JSON.stringify(printed, null, 2)}\n`);
  }
  return exitCode(outcomes);
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    if (error instanceof UsageError) process.stderr.write(`check-technique: ${error.message}\n${USAGE}\n`);
    else if (error instanceof InputError) process.stderr.write(`check-technique: ${error.message}\n`);
    else process.stderr.write(`check-technique: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    process.exitCode = EXIT_INVALID;
  },
);
