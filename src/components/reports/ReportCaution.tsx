/** The caution that travels with every report, on its page as in its PDF. */
export function ReportCaution() {
  return (
    <aside data-testid="report-caution" aria-label="Caution" className="rounded-lg border border-amber-300 bg-amber-50 px-5 py-3 text-amber-950">
      <p>
        <strong>Read before relying on it.</strong> A refraction interpretation is non-unique: other velocity models can explain the same
        travel times, and hidden layers or velocity inversions may not show at all. Calibrate the depths against boreholes or trial pits,
        and have the report reviewed by a qualified professional before it informs excavation or foundation design. Local codes govern.
      </p>
    </aside>
  );
}
