/** Section "Velocity section": the model and the chosen shot's wavefronts and rays, with a layer table. */
import type { ReportContext } from './context';
import { caption, captionHeight, paragraph, sectionHeading } from './flow';
import { colourText } from './colour';
import { plain } from './format';
import { layerOutlines } from './interfaces';
import { CONTENT } from './style';
import { drawTable } from './table';
import { drawVelocityFigure, sectionLayout } from './velocity-figure';

export function drawSection(ctx: ReportContext): void {
  const { input } = ctx;
  sectionHeading(ctx, 'section');
  const m = input.model;
  paragraph(ctx, `Velocity model "${m.name}", version ${m.version}${m.comment.trim() ? ` (${m.comment.trim()})` : ''}, as the solver sees it: sampled at the nodes of its grid. The wavefronts are the first-arrival times of shot ${input.section.shotId} computed on this model; the rays run from each geophone back to the shot.`);
  ctx.y += 6;

  const axisRoom = 44;
  const barRoom = 58;
  const layout = sectionLayout(ctx, CONTENT.left + axisRoom, ctx.y + 14, CONTENT.width - axisRoom - barRoom, 240, 380);
  // Caption text depends on the drawing; measure with a representative one to keep them together.
  ctx.ensureSpace(layout.box.height + 60 + captionHeight(ctx, 'x'.repeat(420)));
  const placed = sectionLayout(ctx, CONTENT.left + axisRoom, ctx.y + 14, CONTENT.width - axisRoom - barRoom, 240, 380);
  const info = drawVelocityFigure(ctx, placed);
  ctx.y = placed.box.top + placed.box.height + 40;
  const ve = info.exaggeration === 1 ? 'True scale (no vertical exaggeration).' : `Vertical exaggeration ${plain(info.exaggeration)}:1.`;
  caption(
    ctx,
    'Figure',
    `Velocity section with the wavefronts of shot ${input.section.shotId} every ${plain(info.contourStepMs, 3)} ms (black lines, labels in ms), ` +
      `rays from the shot to the geophones (red), ground surface (solid)${info.interfaces ? ' and layer interfaces (dashed)' : ''}; stations as triangles, the shot as a star${info.holes ? '; boreholes and trial pits as dark columns with a tick at each logged contact (longer at the top of rock)' : ''}. ` +
      `${colourText(info.colourRange, info.velocityRange, 'the model')} ${ve}`,
  );

  const layers = layerOutlines(m.file, ctx.model);
  if (layers.length) {
    ctx.ensureSpace(40 + layers.length * 14);
    const table = caption(ctx, 'Table', 'Layers of the model, top to bottom; velocity at the top and at the base of each layer, varying linearly with depth in between.');
    ctx.y -= 8;
    drawTable(ctx, {
      continued: `Table ${table} (continued)`,
      columns: [
        { title: 'Layer', width: 200 },
        { title: 'v at top (m/s)', width: 90, align: 'right' },
        { title: 'v at base (m/s)', width: 90, align: 'right' },
      ],
      rows: layers.map((l) => [l.name, plain(l.vTop, 0), plain(l.vBase, 0)]),
    });
  } else {
    paragraph(ctx, 'The model is a velocity grid without layer interfaces (values given node by node).');
  }
  const edits = m.file.edits?.length ?? 0;
  if (edits) paragraph(ctx, `${edits} node${edits === 1 ? '' : 's'} of the grid carry velocities painted over the layers by hand.`);
}
