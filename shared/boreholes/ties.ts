import type { BoreholeTie, BoreholeView } from '../schemas/boreholes';

/**
 * Ties of logged contacts to an interpreted surface: for each hole, the contacts marked as top of rock
 * (or every contact when none is marked), with the interpreted depth below ground at the hole and the
 * difference interpreted − logged (m; positive: the interpretation is deeper). `depthAt(x)` gives the
 * interpreted depth below ground at x, or null where the surface does not reach.
 */
export function boreholeTies(holes: readonly Pick<BoreholeView, 'id' | 'name' | 'x' | 'contacts'>[], depthAt: (x: number) => number | null): BoreholeTie[] {
  const ties: BoreholeTie[] = [];
  for (const h of holes) {
    const marked = h.contacts.filter((c) => c.rockTop);
    const interpreted = depthAt(h.x);
    for (const c of marked.length ? marked : h.contacts) {
      ties.push({
        boreholeId: h.id,
        name: h.name,
        x: h.x,
        contactDepth: c.depth,
        material: c.material,
        interpretedDepth: interpreted,
        differenceM: interpreted === null ? null : +(interpreted - c.depth).toFixed(3),
      });
    }
  }
  return ties;
}
