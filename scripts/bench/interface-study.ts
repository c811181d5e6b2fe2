/**
 * Why the solver treats contrast cells the way it does: every candidate rule on flat two-layer
 * models (500 over 2000 m/s, 0.5 m cells, surface receivers) with the refractor on a node row
 * (10 m) and between rows (10.2, 10.25, 10.4 m), and on the 5° dipping refractor. Max / mean
 * relative error against the head-wave formulas (exact.ts). Prints a markdown table.
 *   npx tsx scripts/bench/interface-study.ts
 */
import { TravelTimeSolver, type InterfaceRule } from '../../shared/eikonal';
import { dippingCase, twoLayerCase } from './cases';
import { errors } from './measure';

const cases = [
  ['flat, 10 m (on a node row)', twoLayerCase(10)],
  ['flat, 10.2 m', twoLayerCase(10.2)],
  ['flat, 10.25 m', twoLayerCase(10.25)],
  ['flat, 10.4 m', twoLayerCase(10.4)],
  ['dipping 5°', dippingCase()],
] as const;
const rules: InterfaceRule[] = ['node', 'mean', 'fastest', 'slowest', 'upper', 'staircase'];
const pct = (v: number): string => (v * 100).toFixed(2);

console.log(`| rule | order | ${cases.map(([name]) => name).join(' | ')} |`);
console.log(`|---|---|${cases.map(() => '---').join('|')}|`);
for (const rule of rules) {
  for (const order of [1, 2] as const) {
    const cells = cases.map(([, c]) => {
      const T = new TravelTimeSolver(c.grid).solve(c.velocity, c.active, c.source, { order, rule });
      const e = errors(c, T);
      return `${pct(e.max)} / ${pct(e.mean)}`;
    });
    console.log(`| ${rule} | ${order} | ${cells.join(' | ')} |`);
  }
}
