/** The standing caution that belongs on every page of a product whose numbers inform excavation. */
export function CautionFooter() {
  return (
    <footer data-testid="caution-footer" className="mt-auto border-t border-stone-200 bg-stone-100/70">
      <p className="mx-auto max-w-6xl px-4 py-4 text-sm text-stone-600 sm:px-6">
        Refraction interpretations are non-unique. Calibrate them against boreholes and have them reviewed by a
        qualified professional before they inform excavation or foundation design; local codes govern.
      </p>
    </footer>
  );
}
