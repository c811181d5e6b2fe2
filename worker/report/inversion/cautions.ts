/** Section "Limitations and cautions" of an inversion: what tomography cannot tell, and who decides. */
import { bullets, bulletsHeight, sectionHeading } from '../flow';
import { plain } from '../format';
import { stationSpacing } from '../line-geometry';
import type { InversionContext } from './context';

export function drawInversionCautions(ctx: InversionContext): void {
  const { input } = ctx;
  const spacing = stationSpacing(input.stations);
  const items = [
    { lead: 'Smooths sharp contacts.', text: 'Tomography finds the smoothest model that explains the picks: a sharp boundary such as the top of rock appears as a velocity gradient spread over several metres. The depth to an iso-velocity depends on the velocity chosen and is not the depth of a contact.' },
    {
      lead: 'Resolution falls with depth.',
      text: `Fewer and longer rays reach deeper ground, so detail is lost with depth; features smaller than the station spacing${spacing ? ` (${plain(spacing)} m)` : ''}, or than the checkerboard squares that were not recovered, are not resolved. Below the depth of investigation nothing is known: the model there is the starting model, smoothed. Greyed parts of the section carry too little ray for their colours to mean anything.`,
    },
    { lead: 'Hidden layers and velocity inversions.', text: 'A layer slower than the one above it sends no first arrivals to the surface and cannot be seen; the inversion puts a gradient where it lies. A thin layer of intermediate velocity can also be missed. Neither shows in the misfit.' },
    { lead: 'Non-uniqueness.', text: 'Many velocity models explain the same first arrivals equally well, within the pick uncertainty. The section is one of them, shaped by the starting model, the smoothing and the damping; it is one interpretation among several possible ones.' },
    { lead: 'Calibration.', text: 'Velocities and depths must be checked against boreholes, trial pits or other direct ground information before they are used. A velocity boundary is not necessarily a geological or an engineering boundary (rippability, excavatability, bearing).' },
    { lead: 'Review.', text: 'The interpretation must be reviewed by a suitably qualified and experienced professional before it informs excavation, foundation or other design decisions.' },
    { lead: 'Codes and standards.', text: 'Local codes, standards and the site investigation specification govern how these results may be used; this report does not replace them.' },
  ];
  const needed = 46 + bulletsHeight(ctx, items) + items.length;
  sectionHeading(ctx, 'cautions', { newPage: ctx.spaceLeft < needed });
  bullets(ctx, items);
}
