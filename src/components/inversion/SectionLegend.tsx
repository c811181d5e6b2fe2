import type { ReactNode } from 'react';
import { SECTION_COLOURS } from '../run/section/drawSection';
import { MASK_RGB } from './coverageMask';
import { DOI_COLOUR } from './drawDoi';

function Item({ swatch, children }: { swatch: ReactNode; children: ReactNode }) {
  return (
    <li className="flex items-center gap-1.5">
      <span aria-hidden="true" className="inline-flex w-6 justify-center">
        {swatch}
      </span>
      {children}
    </li>
  );
}

/** What the marks on an inversion section mean. */
export function SectionLegend({ masked = true, doi = true }: { masked?: boolean; doi?: boolean }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-stone-700" aria-label="Legend">
      <Item swatch={<span className="block h-px w-6" style={{ background: SECTION_COLOURS.wavefront }} />}>Iso-velocity contours (labels in m/s)</Item>
      {doi && <Item swatch={<span className="block w-6 border-t-[3px] border-dashed" style={{ borderColor: DOI_COLOUR }} />}>Depth of investigation (deepest rays)</Item>}
      {masked && <Item swatch={<span className="block h-3 w-5 rounded-sm" style={{ background: `rgb(${MASK_RGB.join(' ')})` }} />}>Too few rays: not resolved</Item>}
      <Item swatch={<span className="block h-0.5 w-6" style={{ background: SECTION_COLOURS.surface }} />}>Ground surface</Item>
      <Item swatch={<span style={{ color: SECTION_COLOURS.station }}>▼</span>}>Stations (geophones)</Item>
      <Item swatch={<span style={{ color: SECTION_COLOURS.shot }}>★</span>}>Shots</Item>
    </ul>
  );
}
