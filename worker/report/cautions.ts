/** Section "Limitations and cautions": what the results cannot tell, and who decides. */
import type { ReportContext } from './context';
import { bullets, paragraph, sectionHeading } from './flow';
import { plain } from './format';
import { stationSpacing } from './line-geometry';

export function drawCautions(ctx: ReportContext): void {
  const { input } = ctx;
  sectionHeading(ctx, 'cautions', { newPage: false });
  const spacing = stationSpacing(input.stations);
  bullets(ctx, [
    { lead: 'Forward model only.', text: 'The velocities were set by the geophysicist and not inverted from the picks. A small misfit shows that this model is consistent with the picks, not that it is the only model that is.' },
    { lead: 'Non-uniqueness.', text: 'Different velocity models can explain the same first arrivals equally well, within the pick uncertainty. Depths and velocities in this report are one interpretation among several possible ones.' },
    { lead: 'Hidden layers and velocity inversions.', text: 'A layer slower than the one above it sends no first arrivals to the surface and is invisible to this method; a thin layer of intermediate velocity can also be hidden. Either makes depths to deeper refractors wrong, usually too deep or too shallow without any sign in the misfit.' },
    {
      lead: 'Resolution.',
      text: `Features smaller than the station spacing${spacing ? ` (${plain(spacing)} m)` : ''} along the line, or than a fraction of the depth below it, are not resolved. Depths are read from a model sampled every ${plain(ctx.model.grid.dz, 3)} m in depth and are no more precise than that; boulders, cavities and narrow weathered zones can be missed.`,
    },
    { lead: 'Calibration.', text: 'Velocities and depths must be checked against boreholes, trial pits or other direct ground information before they are used. A velocity boundary is not necessarily a geological or an engineering boundary (rippability, excavatability, bearing).' },
    { lead: 'Review.', text: 'The interpretation must be reviewed by a suitably qualified and experienced professional before it informs excavation, foundation or other design decisions.' },
    { lead: 'Codes and standards.', text: 'Local codes, standards and the site investigation specification govern how these results may be used; this report does not replace them.' },
  ]);
  paragraph(ctx, `Report ${input.reportId}, status: ${input.status}.`, { colour: '#5d6a73' });
}
