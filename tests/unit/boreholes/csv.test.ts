/**
 * The borehole file (our own format, docs/boreholes.md): the example of the docs read back, and
 * each kind of mistake refused whole with its line and column. The expected values are read off the
 * example by hand.
 */
import { describe, expect, it } from 'vitest';
import { parseBoreholeCsv } from '../../../shared/boreholes';

const EXAMPLE = `# logged on site, invented
hole,kind,x,ground_z,water_depth,depth,material,rock_top
BH1,borehole,42.5,101.2,3.1,0.0,topsoil,
BH1,borehole,42.5,101.2,3.1,1.4,weathered sandstone,
BH1,borehole,42.5,101.2,3.1,6.8,sandstone,yes
TP2,trial pit,80,,,0,made ground,
TP2,trial pit,80,,,2.2,"clay, stiff",no
`;

describe('borehole CSV', () => {
  it('reads the documented example: one hole per name, contacts top-down, top of rock marked', () => {
    const r = parseBoreholeCsv(EXAMPLE);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.boreholes).toHaveLength(2);
    const [bh1, tp2] = r.boreholes;
    expect(bh1).toMatchObject({ name: 'BH1', kind: 'borehole', x: 42.5, groundZ: 101.2, waterDepth: 3.1, line: 3 });
    expect(bh1.contacts).toEqual([
      { depth: 0, material: 'topsoil', rockTop: false },
      { depth: 1.4, material: 'weathered sandstone', rockTop: false },
      { depth: 6.8, material: 'sandstone', rockTop: true },
    ]);
    expect(tp2).toMatchObject({ name: 'TP2', kind: 'trial_pit', x: 80, groundZ: null, waterDepth: null });
    expect(tp2.contacts[1].material).toBe('clay, stiff');
  });

  it('accepts the columns in any order and case, with the optional ones left out', () => {
    const r = parseBoreholeCsv('Material,DEPTH,X,Hole\ngravel,0,10,BH9\nrock,3.5,10,BH9\n');
    expect(r.ok && r.boreholes[0]).toMatchObject({ name: 'BH9', x: 10, kind: 'borehole', contacts: [{ depth: 0 }, { depth: 3.5 }] });
  });

  it('names the line and column of each problem and stores nothing', () => {
    const r = parseBoreholeCsv(`hole,x,depth,material,rock_top
BH1,10,abc,clay,
BH1,12,2,rock,maybe
,10,1,clay,
`);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues).toEqual([
      { line: 2, column: 'depth', message: '"abc" is not a number' },
      { line: 3, column: 'rock_top', message: '"maybe" is not yes or no' },
      { line: 3, column: 'x', message: '"12" differs from "10" on line 2; every row of BH1 must give the same x' },
      { line: 4, column: 'hole', message: 'is empty: name the hole, e.g. BH1' },
    ]);
  });

  it('refuses what the form refuses: contacts out of order, a negative depth, an unknown kind', () => {
    const r = parseBoreholeCsv('hole,kind,x,depth,material\nBH1,borehole,5,2,clay\nBH1,borehole,5,1,rock\nBH2,well,5,0,clay\nBH3,,5,-1,clay\n');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues.map((i) => [i.line, i.column])).toEqual([
      [3, 'depth'],
      [4, 'kind'],
      [5, 'depth'],
    ]);
    expect(r.issues[0].message).toMatch(/top-down/);
  });

  it('refuses a file without the required columns or without rows, and an unknown column', () => {
    expect(parseBoreholeCsv('hole,x,depth\nBH1,1,2\n')).toMatchObject({ ok: false, issues: [{ line: 1, message: expect.stringMatching(/missing: material/) }] });
    expect(parseBoreholeCsv('hole,x,depth,material\n')).toMatchObject({ ok: false, issues: [{ message: 'the file has a header but no rows' }] });
    expect(parseBoreholeCsv('hole,x,depth,material,colour\n')).toMatchObject({ ok: false, issues: [{ message: expect.stringMatching(/unknown column "colour"/) }] });
    expect(parseBoreholeCsv('')).toMatchObject({ ok: false });
  });
});
