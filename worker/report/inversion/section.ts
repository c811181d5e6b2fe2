/** Section "Velocity section from the inversion": the final model with its coverage mask and DOI. */
import { caption, captionHeight, paragraph, sectionHeading } from '../flow';
import { colourText } from '../colour';
import { count, fixed, plain } from '../format';
import { stationSpacing } from '../line-geometry';
import { COLOUR, CONTENT } from '../style';
import { sectionLayoutFor } from '../velocity-figure';
import type { InversionContext } from './context';
import { sectionNo } from './convergence';
import { drawTomogram } from './figure';

export function drawInversionSection(ctx: InversionContext): void {
  const { input } = ctx;
  const inv = input.inversion;
  sectionHeading(ctx, 'section');
  const xs = input.stations.map((s) => s.x);
  const spacing = stationSpacing(input.stations);
  const last = inv.history[inv.history.length - 1];
  const used = input.residuals.filter((r) => !r.excluded).length;
  paragraph(
    ctx,
    (input.stations.length
      ? `Line ${input.line.name}: ${input.stations.length} stations from x = ${plain(Math.min(...xs))} m to ${plain(Math.max(...xs))} m${spacing ? ` (spacing ${plain(spacing)} m)` : ''}, `
      : `Line ${input.line.name}: `) +
      `${input.shots.length} shots, ${count(used)} first-arrival picks. ` +
      `The velocity section below was found from these picks by travel-time tomography (inversion ${inv.id}${inv.label.trim() ? `, "${inv.label.trim()}"` : ''}): ` +
      `after ${last.iteration} iteration${last.iteration === 1 ? '' : 's'} the model explains the picks with χ² per datum ${fixed(last.chi2, 2)} and RMS misfit ${fixed(last.rmsMs, 2)} ms.`,
  );
  const lineNotes = input.line.notes.trim();
  if (lineNotes) paragraph(ctx, lineNotes, { colour: COLOUR.muted });
  paragraph(
    ctx,
    `Only the part of the section that rays cross says anything about the ground. Nodes crossed by less than ${plain(ctx.threshold, 2)} m of ray in total are greyed out, and below the depth of investigation (the deepest ray in each column) the model is simply the starting model smoothed: nothing is known there.`,
  );
  ctx.y += 6;

  const axisRoom = 44;
  const barRoom = 58;
  const place = (top: number) => sectionLayoutFor(ctx.grid, ctx.ground, CONTENT.left + axisRoom, top, CONTENT.width - axisRoom - barRoom, 240, 380);
  ctx.ensureSpace(place(ctx.y + 14).box.height + 60 + captionHeight(ctx, 'x'.repeat(700)));
  const layout = place(ctx.y + 14);
  const info = drawTomogram(ctx, layout);
  ctx.y = layout.box.top + layout.box.height + 40;
  const ve = layout.exaggeration === 1 ? 'True scale (no vertical exaggeration).' : `Vertical exaggeration ${plain(layout.exaggeration)}:1.`;
  caption(
    ctx,
    'Figure',
    `Velocity section from the inversion. ${colourText(info.colourRange, info.velocityRange, 'the covered nodes')} ` +
      `Grey: ray coverage mask, nodes crossed by less than ${plain(ctx.threshold, 2)} m of ray in total (${plain(100 * info.maskedShare, 0)} % of the ground nodes), not resolved; its boundary dotted. ` +
      `Black lines: iso-velocity contours every ${plain(info.contourStep, 0)} m/s with labels in m/s, drawn where the rays reach` +
      (info.isoDrawn ? `; thick blue line: the ${plain(input.isoVelocity, 0)} m/s contour tabulated in section ${sectionNo(ctx, 'isoDepth')}. ` : '. ') +
      (info.doiDrawn ? 'Dashed purple line (DOI): depth of investigation, the deepest ray in each column; the model below it is not constrained by the picks. ' : 'No ray reaches below the surface: there is no depth of investigation. ') +
      `Ground surface (solid), stations as triangles, shots as stars. ${ve}`,
  );
}
