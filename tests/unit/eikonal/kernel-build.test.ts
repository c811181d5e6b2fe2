/**
 * The WebAssembly bytes the solver runs (shared/eikonal/kernel/march-wasm.ts) must be those the
 * AssemblyScript compiler makes from the kernel's source today: a change to march.as.ts without
 * `npm run build:kernel` fails here, so the committed bytes never drift from the source.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileKernel, KERNEL_MODULE, kernelModuleText } from '../../../scripts/lib/compile-kernel';

describe('march kernel bytes', () => {
  it('are the compiled source (run `npm run build:kernel` after changing march.as.ts)', async () => {
    const binary = await compileKernel();
    expect(readFileSync(KERNEL_MODULE, 'utf8')).toBe(kernelModuleText(binary));
  }, 60_000);
});
