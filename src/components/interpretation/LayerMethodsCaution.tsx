/** What the layer methods assume and cannot see, beside the usual caution; on every layer result. */
export function LayerMethodsCaution() {
  return (
    <aside data-testid="layers-caution" aria-label="Limits of the layer methods" className="mb-6 rounded-lg border border-amber-300 bg-amber-50 px-5 py-3 text-amber-950">
      <p>
        <strong>The layer methods assume each layer is faster than the one above it and laterally uniform in velocity.</strong> Read the result with that
        in mind:
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        <li>A layer slower than the one above it (a velocity inversion) never produces first arrivals and is missed; the depths below it come out wrong.</li>
        <li>A thin layer can be hidden: its head wave is overtaken before it arrives first (a blind zone), and the depths below it come out too shallow.</li>
        <li>Depths are found only between reversed shots; plus–minus smears a refractor that dips or changes sharply; the intercept-time method gives depths only near the shots.</li>
        <li>Many ground models fit the same picks. Refraction interpretations are non-unique.</li>
      </ul>
      <p className="mt-1">
        Calibrate against boreholes or trial pits, have the result reviewed by a qualified professional before it informs excavation or
        foundation design, and follow local codes, which govern.
      </p>
    </aside>
  );
}
