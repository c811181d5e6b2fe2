/**
 * `npm run pick -- --records R1.sg2 [R2.sg2 …] [--out P.picks.csv] [--stations S.csv] [--json] [--traces DIR]`
 * (FORMATS.md §3): reads SEG-2 and SEG-Y field records, picks the first arrival on every trace
 * automatically and writes a pick file (FORMATS.md §2; to stdout without --out). Exit 0 when every
 * file could be read, 1 for an unreadable file (nothing written), 2 for usage errors.
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { parseArgs } from 'node:util';
import { readRecord, RecordFormatError, type SeismicRecord } from '../shared/records';
import { parseStationCsv } from '../shared/stations';
import { indent, InputError, runCli, UsageError } from './lib/cli-inputs';
import { formatPickRows, formatTraceTable, pickRecord, type PickRow, type StationMap } from './lib/record-picks';

const USAGE = 'usage: npm run pick -- --records R1.sg2 [R2.sg2 …] [--out P.picks.csv] [--stations S.csv] [--json] [--traces DIR]';

function readOptions(argv: string[]) {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: true,
      options: {
        records: { type: 'string', multiple: true },
        out: { type: 'string' },
        stations: { type: 'string' },
        traces: { type: 'string' },
        json: { type: 'boolean', default: false },
        help: { type: 'boolean', default: false },
      },
    });
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) throw new UsageError('');
  // `--records a.sg2 b.sg2 c.sg2`: the names after the first are positionals.
  const records = [...(values.records ?? []), ...positionals];
  if (!values.records?.length) throw new UsageError('--records is required');
  return { records, out: values.out, stations: values.stations, traces: values.traces, json: values.json };
}

const reason = (err: unknown): string => (err as NodeJS.ErrnoException).code ?? (err as Error).message;

async function readStations(path: string): Promise<StationMap> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the station table (${reason(err)})`);
  }
  const parsed = parseStationCsv(text);
  if (!parsed.ok) {
    const lines = parsed.issues.map((i) => `${i.line ? `line ${i.line}` : 'file'}${i.column ? `, ${i.column}` : ''}: ${i.message}`);
    throw new InputError(`${path}: the station table has errors:\n${indent(lines.join('\n'))}`);
  }
  return new Map(parsed.stations.map((s) => [s.station, { x: s.x, z: s.z }]));
}

async function readOne(path: string): Promise<SeismicRecord> {
  let bytes: Buffer;
  try {
    bytes = await readFile(path);
  } catch (err) {
    throw new InputError(`${path}: cannot read the record (${reason(err)})`);
  }
  try {
    return readRecord(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), path);
  } catch (err) {
    if (err instanceof RecordFormatError) throw new InputError(`${path}: ${err.message}`);
    throw err;
  }
}

async function main(argv: string[]): Promise<void> {
  const opts = readOptions(argv);
  const started = performance.now();
  const stations = opts.stations ? await readStations(opts.stations) : null;
  // Every file is read before anything is written: one bad record, no output.
  const records: [string, SeismicRecord][] = [];
  for (const path of opts.records) records.push([path, await readOne(path)]);

  const rows: PickRow[] = [];
  let traces = 0, unpicked = 0;
  for (const [path, record] of records) {
    const name = basename(path).replace(/\.[^.]+$/, '');
    const result = pickRecord(record, name, stations);
    rows.push(...result.rows);
    traces += record.traces.length;
    unpicked += result.unpicked;
    if (result.unplaced) process.stderr.write(`pick: ${path}: ${result.unplaced} of ${record.traces.length} traces have no source or receiver position (give --stations); counted as unpicked\n`);
  }
  if (opts.traces) {
    await mkdir(opts.traces, { recursive: true });
    for (const [path, record] of records) await writeFile(join(opts.traces, `${basename(path)}.csv`), formatTraceTable(record));
  }
  const csv = formatPickRows(rows);
  if (opts.out) await writeFile(opts.out, csv);
  else process.stdout.write(csv);
  if (opts.json) {
    const seconds = +((performance.now() - started) / 1000).toFixed(3);
    process.stdout.write(`${JSON.stringify({ records: records.length, traces, picked: rows.length, unpicked, seconds })}\n`);
  }
}

runCli('pick', USAGE, () => main(process.argv.slice(2)));
