/**
 * The benchmark's compiled yardstick: plain-fmm.c built with the system's gcc (-O2, nothing
 * machine-specific) and run on a benchmark case's own grid and velocities, alternately with the
 * engine so both see the same machine. The C program times its solves itself, so process
 * start-up and file reading are not counted.
 */
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { TravelTimeSolver } from '../../shared/eikonal';
import type { BenchCase } from './cases';
import { PlainMarcher } from './plain-fmm';

const SOURCE = new URL('./plain-fmm.c', import.meta.url);

export interface CompiledComparison {
  engineSeconds: number;
  compiledSeconds: number;
  /** Median over rounds of compiled time ÷ engine time: the engine's speed as a fraction of the compiled solver's. */
  speedRatio: number;
}

/** Builds the C solver once per source version; null (with the reason) when gcc is missing. */
export function buildCompiledReference(): { binary: string } | { error: string } {
  const code = readFileSync(SOURCE);
  const dir = join(tmpdir(), 'timefield-bench');
  const binary = join(dir, `plain-fmm-${createHash('sha256').update(code).digest('hex').slice(0, 12)}`);
  if (existsSync(binary)) return { binary };
  mkdirSync(dir, { recursive: true });
  try {
    execFileSync('gcc', ['-O2', '-std=c99', '-D_POSIX_C_SOURCE=199309L', '-o', binary, SOURCE.pathname, '-lm'], { stdio: 'pipe' });
  } catch (err) {
    return { error: `gcc could not build scripts/bench/plain-fmm.c: ${(err as Error).message.split('\n')[0]}` };
  }
  return { binary };
}

/** Nearest node to the case's source (the C solver starts on a node). */
export function sourceNode(c: BenchCase): number {
  const { grid } = c;
  return Math.round((grid.z0 - c.source.z) / grid.dz) * grid.nx + Math.round((c.source.x - grid.x0) / grid.dx);
}

/** Runs the C solver `repeats` times on the case; per-solve seconds and the checksum of its times. */
export function runCompiled(binary: string, c: BenchCase, order: 1 | 2, repeats: number): { seconds: number[]; checksum: number } {
  const { nx, nz, dx } = c.grid;
  const head = Buffer.alloc(5 * 4 + 8);
  [nx, nz, sourceNode(c), order, repeats].forEach((v, i) => head.writeInt32LE(v, 4 * i));
  head.writeDoubleLE(dx, 20);
  const input = join(tmpdir(), 'timefield-bench', `case-${process.pid}.bin`);
  writeFileSync(input, Buffer.concat([head, Buffer.from(c.velocity.buffer, c.velocity.byteOffset, c.velocity.byteLength)]));
  const out = execFileSync(binary, [input], { encoding: 'utf8' });
  const seconds = [...out.matchAll(/^seconds (\S+)$/gm)].map((m) => Number(m[1]));
  const checksum = Number(/^checksum (\S+)$/m.exec(out)?.[1]);
  return { seconds, checksum };
}

/**
 * A check that the C solver solves: its first-order times summed over the grid against the same
 * sum from the TypeScript plain marcher (same algorithm, separate code), relative difference.
 */
export function checksumAgreement(binary: string, c: BenchCase): number {
  const compiled = runCompiled(binary, c, 1, 1).checksum;
  const T = new PlainMarcher(c.grid, c.velocity).solve(sourceNode(c));
  let sum = 0;
  for (let i = 0; i < T.length; i++) if (Number.isFinite(T[i])) sum += T[i];
  return Math.abs(compiled - sum) / sum;
}

/** Engine and compiled solver on the same case, `rounds` rounds of `batch` solves each, alternately. */
export function compareWithCompiled(binary: string, c: BenchCase, order: 1 | 2, rounds: number, batch = 3): CompiledComparison {
  const engine = new TravelTimeSolver(c.grid);
  const out = new Float64Array(c.grid.nx * c.grid.nz);
  const e: number[] = [];
  const k: number[] = [];
  const r: number[] = [];
  for (let round = -1; round < rounds; round++) {
    const times: number[] = [];
    for (let i = 0; i < batch; i++) {
      const t0 = performance.now();
      engine.solve(c.velocity, c.active, c.source, { order, cellSlowness: c.cellSlowness }, out);
      times.push((performance.now() - t0) / 1000);
    }
    const compiled = runCompiled(binary, c, order, batch).seconds;
    if (round < 0) continue; // warm-up
    const te = median(times), tc = median(compiled);
    e.push(te);
    k.push(tc);
    r.push(tc / te);
  }
  return { engineSeconds: median(e), compiledSeconds: median(k), speedRatio: median(r) };
}

function median(values: number[]): number {
  const v = [...values].sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length % 2 ? v[m] : (v[m - 1] + v[m]) / 2;
}
