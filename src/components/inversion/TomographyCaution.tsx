/** What travel-time tomography cannot do, in plain words, beside the usual caution; on every inversion page. */
export function TomographyCaution() {
  return (
    <aside data-testid="tomography-caution" aria-label="Limits of tomography" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-3 text-amber-950">
      <p>
        <strong>An inverted section is a smoothed picture, not a drawing of the ground.</strong> Read it with its limits in mind:
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        <li>Sharp contacts, such as rockhead, come out as gradual changes; an iso-velocity line between the layer velocities is an estimate of the contact, not its trace.</li>
        <li>Resolution falls with depth: fewer and longer rays reach deep ground, and below the depth of investigation no ray turned at all.</li>
        <li>A thin layer, or a slower layer under a faster one, can be missed entirely: first arrivals may never travel through it.</li>
        <li>Many models fit the same picks: the result depends on the starting model and the smoothing. Refraction interpretations are non-unique.</li>
      </ul>
      <p className="mt-1">
        Calibrate against boreholes or trial pits, have the result reviewed by a qualified professional before it informs excavation or
        foundation design, and follow local codes, which govern.
      </p>
    </aside>
  );
}
