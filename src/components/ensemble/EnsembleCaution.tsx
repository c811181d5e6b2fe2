import { ENSEMBLE_CAUTION } from '../../../shared/uncertainty/wording';

/** What an ensemble's band does and does not cover, on every ensemble page. */
export function EnsembleCaution() {
  return (
    <aside data-testid="ensemble-caution" aria-label="What the band covers" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-3 text-amber-950">
      <p>
        <strong>A band, not a guarantee.</strong> {ENSEMBLE_CAUTION}
      </p>
    </aside>
  );
}
