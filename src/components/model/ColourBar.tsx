import { lutGradient, type VelocityRange } from './colourScale';
import { niceTicks } from './sectionGeometry';

/** The velocity scale beside the section: slow at the bottom, fast at the top, ticks in m/s. */
export function ColourBar({ range, height, top }: { range: VelocityRange; height: number; top: number }) {
  const ticks = niceTicks(range.lo, range.hi, 6);
  return (
    <figure data-testid="colour-bar" className="flex shrink-0 flex-col items-start" style={{ paddingTop: top }} aria-label={`Colour scale from ${range.lo} to ${range.hi} m/s`}>
      <div className="relative flex" style={{ height }}>
        <div className="w-4 rounded-sm border border-stone-300" style={{ background: lutGradient() }} />
        <div className="relative ml-1 w-14">
          {ticks.map((t) => (
            <span
              key={t}
              className="absolute left-0 -translate-y-1/2 text-xs tabular-nums text-stone-700 before:mr-1 before:inline-block before:h-px before:w-1.5 before:bg-stone-500 before:align-middle before:content-['']"
              style={{ top: `${(1 - (t - range.lo) / (range.hi - range.lo)) * 100}%` }}
            >
              {t}
            </span>
          ))}
        </div>
      </div>
      <figcaption className="mt-2 text-sm font-semibold text-stone-700">v (m/s)</figcaption>
      <p className="mt-1 flex items-center gap-1 text-xs text-stone-600">
        <span className="inline-block h-3 w-3 border border-stone-300" style={{ background: 'rgb(236 241 244)' }} /> air
      </p>
    </figure>
  );
}
