/** The caution that belongs beside every misfit figure, on the results page itself. */
export function RunCaution() {
  return (
    <aside data-testid="run-caution" aria-label="Caution" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-3 text-amber-950">
      <p>
        <strong>Forward model only.</strong> A good fit shows that this model is <em>one</em> explanation of the picks, not the only one:
        refraction interpretations are non-unique. Calibrate against boreholes, have the result reviewed by a qualified professional before
        it informs excavation or foundation design, and follow local codes, which govern.
      </p>
    </aside>
  );
}
