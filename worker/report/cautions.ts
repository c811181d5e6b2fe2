/** Section "Limitations and cautions": what the results cannot tell, and who decides. */
import type { ReportContext } from './context';
import { bullets, bulletsHeight, sectionHeading } from './flow';
import { plain } from './format';
import { stationSpacing } from './line-geometry';

export function drawCautions(ctx: ReportContext): void {
  const { input } = ctx;
  const spacing = stationSpacing(input.stations);
  const items = [
    { lead: 'Forward model only.', text: 'The velocities were set by the geophysicist and not inverted from the picks. A small misfit shows that this model is consistent with the picks, not that it is the only model that is.' },
    { lead: 'Non-uniqueness.', text: 'Different velocity models can explain the same first arrivals equally well, within the pick uncertainty. Depths and velocities in this report are one interpretation among several possible ones.' },
    { lead: 'Hidden layers and velocity inversions.', text: 'A layer slower than the one above it sends no first arrivals to the surface and is invisible to this method; a thin layer of intermediate velocity can also be hidden. An undetected slow layer makes the depths to deeper refractors too large, a hidden intermediate layer makes them too small, and neither shows in the misfit.' },
    {
      lead: 'Resolution.',
      text: `Features smaller than the station spacing${spacing ? ` (${plain(spacing)} m)` : ''} along the line, or than a fraction of the depth below it, are not resolved. Depths are read from a model sampled every ${plain(ctx.model.grid.dz, 3)} m in depth and are no more precise than that; boulders, cavities and narrow weathered zones can be missed.`,
    },
    { lead: 'Calibration.', text: 'Velocities and depths must be checked against boreholes, trial pits or other direct ground information before they are used. A velocity boundary is not necessarily a geological or an engineering boundary (rippability, excavatability, bearing).' },
    { lead: 'Review.', text: 'The interpretation must be reviewed by a suitably qualified and experienced professional before it informs excavation, foundation or other design decisions.' },
    { lead: 'Codes and standards.', text: 'Local codes, standards and the site investigation specification govern how these results may be used; this report does not replace them.' },
  ];
  // The cautions are read as a whole: they follow the method statement only if they fit below it.
  // Heading with the gap above it ≈ 46 pt; a point per item for the wider semibold lead-ins.
  const needed = 46 + bulletsHeight(ctx, items) + items.length;
  sectionHeading(ctx, 'cautions', { newPage: ctx.spaceLeft < needed });
  bullets(ctx, items);
}
