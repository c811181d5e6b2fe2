import type { FarPositionResult } from '../../../../shared/qc';

/** How many far positions are listed before "and N more". */
const SHOWN = 12;

/**
 * Sources or receivers far from every station of the line (shared/qc/far-positions.ts): a warning
 * to check the positions, not a refusal; the picks are stored as uploaded.
 */
export function FarPositionsWarning({ result }: { result: FarPositionResult }) {
  if (!result.positions.length || result.limit === null) return null;
  const more = result.positions.length - SHOWN;
  return (
    <div role="status" data-testid="far-positions" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-4 text-stone-900">
      <p className="font-semibold">
        {result.positions.length === 1 ? 'One pick position lies' : `${result.positions.length} pick positions lie`} far from every station of this line
      </p>
      <p className="mt-1 text-sm text-stone-700">
        More than three station spacings ({result.limit.toFixed(1)} m) from the nearest station. An off-end shot can be that far on purpose; otherwise look for a
        typing error in the pick file (a missing decimal point, a coordinate in the wrong column) or a station table that is not complete.
      </p>
      <ul className="mt-2 list-disc pl-5 text-sm">
        {result.positions.slice(0, SHOWN).map((p) => (
          <li key={`${p.role}|${p.shotId}|${p.x}`}>
            {p.message} ({p.picks === 1 ? '1 pick' : `${p.picks} picks`})
          </li>
        ))}
      </ul>
      {more > 0 && <p className="mt-1 text-sm text-stone-700">… and {more} more.</p>}
    </div>
  );
}
