/**
 * Reading a model file and a pick file for the command-line tools (solve, invert), with the
 * messages FORMATS.md promises: the file name, then the JSON path or the line and column.
 */
import '../../shared/schemas/messages'; // plain sentences for schema checks, before any schema runs
import { createReadStream } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import { formatModelIssues, parseModelFile } from '../../shared/model';
import { createPickParser, formatPickError, type Pick, type PickError } from '../../shared/picks';

/** Wrong command line: exit 2. */
export class UsageError extends Error {}
/** Bad input files or positions: exit 1. */
export class InputError extends Error {}

/** `--threads N`: 1–256, default every core. */
export function threadCount(text: string | undefined): number {
  const threads = text === undefined ? Math.max(1, availableParallelism()) : Number(text);
  if (!Number.isInteger(threads) || threads < 1 || threads > 256) throw new UsageError(`--threads must be a whole number from 1 to 256 (got ${text})`);
  return threads;
}

export const indent = (text: string): string => text.split('\n').map((l) => `  ${l}`).join('\n');
export const pickErrors = (path: string, what: string, errors: PickError[]): string =>
  `${path}: ${what}:\n${indent(errors.map(formatPickError).join('\n'))}`;

const reason = (err: unknown): string => (err as NodeJS.ErrnoException).code ?? (err as Error).message;

export async function readModel(path: string) {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the model file (${reason(err)})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    throw new InputError(`${path}: not valid JSON (${(err as Error).message})`);
  }
  const parsed = parseModelFile(json);
  if (!parsed.ok) throw new InputError(`${path}: the model file has errors:\n${indent(formatModelIssues(parsed.issues))}`);
  return parsed.model;
}

/** Writes an output file; a failure is an input error naming the file and what it was to hold. */
export async function writeOutput(path: string, text: string, what: string): Promise<void> {
  try {
    await writeFile(path, text);
  } catch (err) {
    throw new InputError(`${path}: cannot write the ${what} (${reason(err)})`);
  }
}

/** Streams the file through the chunked parser (never holds more than one chunk of text plus the picks). */
export async function readPicks(path: string): Promise<Pick[]> {
  const parser = createPickParser();
  try {
    for await (const chunk of createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 16 })) parser.push(chunk as string);
  } catch (err) {
    throw new InputError(`${path}: cannot read the pick file (${reason(err)})`);
  }
  const result = parser.finish();
  if (!result.ok) throw new InputError(pickErrors(path, 'the pick file has errors', result.errors));
  return result.picks;
}

/** Exit codes and messages shared by the tools: 2 usage, 1 input or internal error, never a stack trace. */
export function runCli(name: string, usage: string, main: () => Promise<void>): void {
  main().then(
    () => {
      process.exitCode = 0;
    },
    (err: unknown) => {
      if (err instanceof UsageError) {
        process.stderr.write(`${err.message ? `${name}: ${err.message}\n` : ''}${usage}\n`);
        process.exitCode = 2;
      } else if (err instanceof InputError) {
        process.stderr.write(`${name}: ${err.message}\n`);
        process.exitCode = 1;
      } else {
        process.stderr.write(`${name}: internal error: ${err instanceof Error ? err.message : String(err)}\n`);
        process.exitCode = 1;
      }
    },
  );
}
