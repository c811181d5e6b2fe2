/**
 * Section "Boreholes and ties", shared by the forward-run and the inversion report: the line's
 * boreholes and trial pits as logged when the report was made, and each logged contact against the
 * interpreted surfaces at the hole (interpreted − logged, m; shared/boreholes/ties.ts), with what the
 * ties do and do not show. Without holes it says plainly that nothing calibrates the interpretation.
 */
import { boreholeTies, groundAt } from '../../shared/boreholes';
import type { PageFlow } from './context';
import { bullets, caption, paragraph, sectionHeading } from './flow';
import { fixed } from './format';
import { drawTable } from './table';
import type { ReportBorehole } from './types';

/** A surface the contacts are tied to: its name in the table, and its depth below ground at x (null where it does not reach). */
export interface TieSurface {
  name: string;
  depthAt: (x: number) => number | null;
  /** What to print where there is no depth (default "not reached"). */
  noneText?: (x: number) => string;
}

export function drawBoreholes<K extends string>(ctx: PageFlow<K>, key: K, holes: readonly ReportBorehole[], surfaces: readonly TieSurface[], stations: readonly { x: number; z: number }[]): void {
  sectionHeading(ctx, key, { newPage: false });
  if (!holes.length) {
    paragraph(
      ctx,
      'No boreholes or trial pits had been entered for this line when this report was made, so nothing in it has been checked against direct observation of the ground. ' +
        'Treat every depth here as indicative until the interpretation has been calibrated against boreholes or trial pits.',
    );
    return;
  }
  const pits = holes.filter((h) => h.kind === 'trial_pit').length;
  paragraph(
    ctx,
    `${[count(holes.length - pits, 'borehole'), count(pits, 'trial pit')].filter(Boolean).join(' and ')} on the line, as logged by the project team (depth below ground where each material begins; ` +
      'ground elevation as logged, else from the stations).',
  );
  ctx.y += 2;
  ctx.ensureSpace(60);
  caption(ctx, 'Table', 'Boreholes and trial pits: position, ground, water level and logged contacts (m).');
  ctx.y -= 8;
  drawTable(ctx, {
    size: 8,
    columns: [
      { title: 'Hole', width: 46 },
      { title: 'Kind', width: 48 },
      { title: 'x (m)', width: 40, align: 'right' },
      { title: 'Ground (m)', width: 52, align: 'right' },
      { title: 'Water (m)', width: 46, align: 'right' },
      { title: 'Contacts: depth, material', width: 246 },
    ],
    rows: holes.map((h) => {
      const ground = h.groundZ ?? groundAt(stations, h.x);
      const contacts = h.contacts.map((c) => `${fixed(c.depth, 1)} ${c.material}${c.rockTop ? ' (top of rock)' : ''}`).join('; ');
      return [h.name, h.kind === 'trial_pit' ? 'trial pit' : 'borehole', fixed(h.x, 1), ground === null ? '—' : fixed(ground, 2), h.waterDepth === null ? '—' : fixed(h.waterDepth, 1), contacts || '—'];
    }),
  });

  if (surfaces.length) {
    const ties = surfaces.map((s) => boreholeTies(holes.map((h, i) => ({ ...h, id: String(i) })), s.depthAt));
    ctx.y += 4;
    ctx.ensureSpace(60);
    caption(
      ctx,
      'Table',
      `Ties: each contact marked top of rock (every contact of a hole with none marked) against ${surfaces.map((s) => s.name).join(' and ')} at the hole; depth below ground, difference = interpreted − logged (m; positive: the interpretation is deeper).`,
    );
    ctx.y -= 8;
    drawTable(ctx, {
      size: 8,
      columns: [
        { title: 'Hole', width: 46 },
        { title: 'Contact', width: 110 },
        { title: 'Logged', width: 40, align: 'right' },
        ...surfaces.flatMap((s) => [
          { title: short(s.name), width: 84, align: 'right' as const },
          { title: 'Difference', width: 57, align: 'right' as const },
        ]),
      ],
      rows: ties[0].map((t, r) => [
        t.name,
        t.material,
        fixed(t.contactDepth, 1),
        ...ties.flatMap((list, k) => {
          const u = list[r];
          const none = surfaces[k].noneText?.(u.x) ?? 'not reached';
          return [u.interpretedDepth === null ? none : fixed(u.interpretedDepth, 1), u.differenceM === null ? '—' : signed(u.differenceM)];
        }),
      ]),
    });
  }
  ctx.y += 4;
  bullets(ctx, [
    { lead: 'At the holes only.', text: 'The ties compare the interpretation with the logs where the holes are. Between holes the ground is interpreted, not observed, and other models fit the picks as well; agreement at the holes does not make the section right between them.' },
    { lead: 'Different boundaries.', text: 'A logged contact (a change of material) and a seismic boundary (a change of velocity) need not be the same surface: weathering, fracturing and water change velocity without a change of material, and the reverse.' },
    { lead: 'Large differences.', text: 'Where a difference is large, review the log and the interpretation together (the layers or the velocity taken as rock) before using either for design.' },
    { lead: 'The logs.', text: 'Positions, depths and materials are as entered by the project team; Timefield does not check them against the original logs.' },
  ]);
}

/** "1 borehole", "3 trial pits"; empty for none. */
const count = (n: number, what: string): string => (n === 0 ? '' : `${n} ${what}${n === 1 ? '' : 's'}`);
const signed = (d: number): string => `${d > 0 ? '+' : ''}${fixed(d, 1)}`;
/** A table header short enough for its column. */
const short = (name: string): string => (name.length > 22 ? `${name.slice(0, 21)}…` : name);
