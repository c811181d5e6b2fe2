/**
 * Section "Accuracy of the depth to v*" of an inversion report, when the inversion has a combined
 * ensemble (issue 20): the accuracy statement taken from the 5–95 % band, what the members varied and
 * which were used, the band per station, and what the band does not cover.
 */
import { bandTies } from '../../../shared/uncertainty/band-ties';
import { ENSEMBLE_CAUTION, accuracyStatement, variationWords } from '../../../shared/uncertainty/wording';
import { caption, paragraph, sectionHeading } from '../flow';
import { fixed, NONE } from '../format';
import { drawTable } from '../table';
import type { InversionContext } from './context';

export function drawInversionAccuracy(ctx: InversionContext): void {
  const e = ctx.input.ensemble;
  if (!e) return;
  sectionHeading(ctx, 'accuracy');
  paragraph(ctx, accuracyStatement(e.bands, e.rock, e.used));
  const varied = variationWords(e.vary, e.rock);
  paragraph(
    ctx,
    `The inversion was repeated ${e.members} times (seed ${e.seed}), each member drawing anew ${varied.join('; ')}. ` +
      `${e.used} members explain the picks to χ² ≤ ${fixed(e.maxChi2, 2)} and make the band; ${e.excluded} explained them worse and were left out. ` +
      'At each station the depth is the median of the members that resolve it there, and the band runs from the 5th to the 95th percentile of their depths; where fewer than half resolve it, no band is given.',
  );
  const ties = bandTies(e.bands, ctx.input.boreholes ?? []);
  if (ties.length) {
    const words = { inside: 'inside the band', shallower: 'shallower than the band', deeper: 'deeper than the band', 'no band': 'where there is no band' };
    paragraph(
      ctx,
      `Against the logs: ${ties.map((t) => `${t.name} (x ${fixed(t.x, 1)} m) logs the top of rock at ${fixed(t.logged, 1)} m${t.band ? `, band ${fixed(t.band.p5, 1)}–${fixed(t.band.p95, 1)} m` : ''}: ${words[t.verdict]}`).join('; ')}. ` +
        'Where a log lies outside the band, the rock velocity or the model does not match the ground there; calibrate before reading depths elsewhere.',
    );
  }
  paragraph(ctx, ENSEMBLE_CAUTION);
  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', 'Depth below ground (m) at the stations: 5th percentile, median and 95th percentile of the ensemble members, the width of the band, and how many members resolve the depth there.');
  ctx.y -= 8;
  const m = (v: number | null) => (v === null ? NONE : fixed(v, 1));
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Station', width: 55 },
      { title: 'x (m)', width: 55, align: 'right' },
      { title: '5 % (m)', width: 75, align: 'right' },
      { title: 'Median (m)', width: 80, align: 'right' },
      { title: '95 % (m)', width: 75, align: 'right' },
      { title: 'Band (m)', width: 70, align: 'right' },
      { title: 'Members', width: 69, align: 'right' },
    ],
    rows: e.bands.map((b) => [b.station, fixed(b.x, 2), m(b.p5), m(b.median), m(b.p95), b.p5 === null || b.p95 === null ? NONE : fixed(b.p95 - b.p5, 1), String(b.resolved)]),
  });
}
