// Probability-of-detection analysis of a demonstration from the command line.
//
//   npm run analyse-pod -- FILE.csv [options]
//
// FILE.csv has a header row with `size_mm` and either `hit` (1/0, yes/no, hit/miss) for a hit/miss
// demonstration or `signal` (â) for a signal-response one. Prints the analysis as JSON.
// Exit status: 0 with a result; 2 when the input or the data cannot give one (the reason on stderr).
import { readFile } from 'node:fs/promises';
import { parse } from 'csv-parse/sync';
import { analyseHitMiss, analyseSignalResponse, type HitMissObservation, type SignalObservation } from '../shared/domain/pod/index';
import { HIT_VALUES_TEXT, parseHit } from '../shared/domain/pod/hit-values';

const USAGE = `Usage: npm run analyse-pod -- FILE.csv [--link logit|probit] [--scale log|linear]
       [--decision-threshold A] [--recording-threshold A] [--saturation A] [--noise NOISE.csv]
FILE.csv: header row with size_mm and either hit (hit/miss) or signal (signal response).
NOISE.csv: signal values on flaw-free sites, one column named signal.
--decision-threshold is required for signal-response data. Exit status: 0 result, 2 no result.`;

const EXIT_RESULT = 0;
const EXIT_NO_RESULT = 2;

class InputError extends Error {}

interface Arguments {
  file: string;
  link: 'logit' | 'probit';
  scale: 'log' | 'linear';
  decisionThreshold?: number;
  recordingThreshold?: number;
  saturation?: number;
  noiseFile?: string;
}

function positiveNumber(flag: string, text: string | undefined): number {
  const value = Number(text);
  if (text === undefined || text.trim() === '' || !Number.isFinite(value) || value <= 0) throw new InputError(`${flag} needs a number greater than zero`);
  return value;
}

function parseArguments(argv: string[]): Arguments | 'help' {
  let file: string | undefined;
  const args: Omit<Arguments, 'file'> = { link: 'logit', scale: 'log' };
  for (let i = 0; i < argv.length; i++) {
    const [flag, inline] = argv[i].startsWith('--') && argv[i].includes('=') ? argv[i].split(/=(.*)/s, 2) : [argv[i], undefined];
    const value = () => inline ?? argv[++i];
    switch (flag) {
      case '--help':
      case '-h':
        return 'help';
      case '--link': {
        const link = value();
        if (link !== 'logit' && link !== 'probit') throw new InputError('--link must be logit or probit');
        args.link = link;
        break;
      }
      case '--scale': {
        const scale = value();
        if (scale !== 'log' && scale !== 'linear') throw new InputError('--scale must be log or linear');
        args.scale = scale;
        break;
      }
      case '--decision-threshold':
        args.decisionThreshold = positiveNumber(flag, value());
        break;
      case '--recording-threshold':
        args.recordingThreshold = positiveNumber(flag, value());
        break;
      case '--saturation':
        args.saturation = positiveNumber(flag, value());
        break;
      case '--noise':
        args.noiseFile = value();
        if (!args.noiseFile) throw new InputError('--noise needs a file name');
        break;
      default:
        if (flag.startsWith('-')) throw new InputError(`unknown option ${flag}`);
        if (file) throw new InputError('give one data file');
        file = flag;
    }
  }
  if (!file) throw new InputError('no data file given');
  return { file, ...args };
}

/** Header names compared without case, spaces, '-' or '_'. */
const normalise = (name: string) => name.toLowerCase().replace(/[\s_-]/g, '');

async function readRows(file: string): Promise<Record<string, string>[]> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    throw new InputError(`cannot read ${file}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  try {
    return parse(text, { columns: (header: string[]) => header.map(normalise), bom: true, trim: true, skip_empty_lines: true }) as Record<string, string>[];
  } catch (error) {
    throw new InputError(`${file} is not a readable CSV file: ${(error as Error).message}`);
  }
}

function numberAt(row: Record<string, string>, column: string, line: number): number {
  const text = row[column];
  const value = Number(text);
  if (text === undefined || text === '' || !Number.isFinite(value)) throw new InputError(`row ${line}: ${column} must be a number (found "${text ?? ''}")`);
  return value;
}

async function analyse(args: Arguments) {
  const rows = await readRows(args.file);
  if (rows.length === 0) throw new InputError(`${args.file} has no data rows`);
  const columns = Object.keys(rows[0]);
  if (!columns.includes('sizemm')) throw new InputError(`${args.file} needs a size_mm column`);
  // Spreadsheet numbering: the header is row 1.
  if (columns.includes('hit')) {
    const data: HitMissObservation[] = rows.map((row, i) => {
      const hit = parseHit(row.hit ?? '');
      if (hit === null) throw new InputError(`row ${i + 2}: hit must be ${HIT_VALUES_TEXT} (found "${row.hit}")`);
      return { sizeMm: numberAt(row, 'sizemm', i + 2), hit };
    });
    return analyseHitMiss(data, { link: args.link, scale: args.scale });
  }
  if (columns.includes('signal')) {
    if (args.decisionThreshold === undefined) throw new InputError('signal-response data need --decision-threshold');
    const data: SignalObservation[] = rows.map((row, i) => ({ sizeMm: numberAt(row, 'sizemm', i + 2), signal: numberAt(row, 'signal', i + 2) }));
    let noise: number[] | undefined;
    if (args.noiseFile) {
      const noiseRows = await readRows(args.noiseFile);
      noise = noiseRows.map((row, i) => numberAt(row, 'signal', i + 2));
    }
    return analyseSignalResponse(data, {
      decisionThreshold: args.decisionThreshold,
      recordingThreshold: args.recordingThreshold,
      saturation: args.saturation,
      noise,
    });
  }
  throw new InputError(`${args.file} needs a hit column (hit/miss data) or a signal column (signal response)`);
}

async function main(): Promise<number> {
  const args = parseArguments(process.argv.slice(2));
  if (args === 'help') {
    process.stdout.write(`${USAGE}\n`);
    return EXIT_RESULT;
  }
  const result = await analyse(args);
  if (!result.ok) {
    process.stderr.write(`analyse-pod: no result: ${result.reason}\n`);
    process.stdout.write(`${JSON.stringify({ ok: false, code: result.code, reason: result.reason }, null, 2)}\n`);
    return EXIT_NO_RESULT;
  }
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  return EXIT_RESULT;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    if (error instanceof InputError) process.stderr.write(`analyse-pod: ${error.message}\n${USAGE}\n`);
    else process.stderr.write(`analyse-pod: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    process.exitCode = EXIT_NO_RESULT;
  },
);
