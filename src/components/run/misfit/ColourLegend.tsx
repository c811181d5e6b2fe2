import { RDBU_9 } from './divergingColor';

/** The diverging scale with its limits in ms and what each end means. */
export function ColourLegend({ limit, negative, positive, testId }: { limit: number; negative: string; positive: string; testId?: string }) {
  return (
    <div data-testid={testId} className="mt-3 max-w-xl text-sm text-stone-700">
      <div aria-hidden="true" className="h-3 rounded-sm border border-stone-300" style={{ background: `linear-gradient(to right, ${RDBU_9.join(', ')})` }} />
      <div className="mt-1 flex justify-between tabular-nums">
        <span>−{limit} ms</span>
        <span>0</span>
        <span>+{limit} ms</span>
      </div>
      <div className="flex justify-between gap-4">
        <span>{negative}</span>
        <span className="text-right">{positive}</span>
      </div>
      <p className="mt-1 text-stone-600">Values beyond ±{limit} ms are drawn at full colour. Hatched cells are excluded picks; blank cells have no pick.</p>
    </div>
  );
}
