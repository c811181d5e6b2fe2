import { useState, type FormEvent } from 'react';
import { fitApparentVelocity, type QcPick } from '../../../../shared/qc';
import type { PickSetShot } from '../../../api/types';
import { Button } from '../../Button';
import { SelectField, TextField } from '../../Field';
import { DataTable, Td, Th, Tr } from '../../Table';
import { interceptAtSourceMs, type KeptFit } from './fits';
import { showMetres, showMs, showR2, showVelocity } from './numbers';

export interface FitRequest {
  shotId: string;
  xFrom: string;
  xTo: string;
}

let nextFitId = 1;

/**
 * Straight-line fits over a chosen x range of one shot's curve, labelled in m/s: the slopes a
 * layer interpretation starts from. The range comes from the two inputs or from dragging on the chart.
 */
export function ApparentVelocityPanel({
  shots,
  picksOfShot,
  request,
  onRequest,
  fits,
  onFits,
}: {
  shots: PickSetShot[];
  picksOfShot: (shotId: string) => QcPick[];
  request: FitRequest;
  onRequest: (r: FitRequest) => void;
  fits: KeptFit[];
  onFits: (fits: KeptFit[]) => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const shot = shots.find((s) => s.shotId === request.shotId);
    const a = Number(request.xFrom.trim() === '' ? NaN : request.xFrom);
    const b = Number(request.xTo.trim() === '' ? NaN : request.xTo);
    if (!shot) return setProblem('Choose a shot.');
    if (!Number.isFinite(a) || !Number.isFinite(b)) return setProblem('Enter both ends of the range in metres, or drag across the chart.');
    const lo = Math.min(a, b);
    const hi = Math.max(a, b);
    if (lo < shot.sourceX && hi > shot.sourceX)
      return setProblem(`The range ${showMetres(lo)}–${showMetres(hi)} m spans the source of ${shot.shotId} at x = ${showMetres(shot.sourceX)} m. Fit one side of the source at a time.`);
    const fit = fitApparentVelocity(picksOfShot(shot.shotId), lo, hi);
    if (!fit) return setProblem(`Shot ${shot.shotId} has fewer than two usable picks between ${showMetres(lo)} and ${showMetres(hi)} m (or their times do not change). Widen the range.`);
    setProblem(null);
    onFits([...fits, { id: nextFitId++, shotId: shot.shotId, sourceX: shot.sourceX, xFrom: lo, xTo: hi, fit }]);
  }

  return (
    <div data-testid="velocity-panel">
      <form noValidate onSubmit={onSubmit} className="grid grid-cols-2 items-end gap-3 sm:grid-cols-[minmax(8.5rem,1.4fr)_minmax(5rem,1fr)_minmax(5rem,1fr)_auto]">
        <SelectField label="Shot" value={request.shotId} onChange={(e) => onRequest({ ...request, shotId: e.target.value })} data-testid="fit-shot" className="col-span-2 sm:col-span-1">
          {shots.map((s) => (
            <option key={s.shotId} value={s.shotId}>
              {s.shotId} at {showMetres(s.sourceX)} m
            </option>
          ))}
        </SelectField>
        <TextField label="From x (m)" inputMode="decimal" value={request.xFrom} onChange={(e) => onRequest({ ...request, xFrom: e.target.value })} data-testid="fit-from" />
        <TextField label="To x (m)" inputMode="decimal" value={request.xTo} onChange={(e) => onRequest({ ...request, xTo: e.target.value })} data-testid="fit-to" />
        <Button type="submit" data-testid="fit-add" className="col-span-2 sm:col-span-1">
          Fit line
        </Button>
      </form>
      {problem && (
        <p role="alert" className="mt-2 text-sm font-semibold text-red-800">
          {problem}
        </p>
      )}
      <div className="mt-4">
        {fits.length === 0 ? (
          <p className="text-sm text-stone-600">No fits yet. Each fit is drawn on the chart with its velocity and kept here until you leave the pick set.</p>
        ) : (
          <DataTable caption="Apparent-velocity fits" testId="fit-table" minWidth="38rem">
            <thead>
              <tr>
                <Th>Shot</Th>
                <Th numeric>x range (m)</Th>
                <Th numeric>Picks</Th>
                <Th numeric>Velocity (m/s)</Th>
                <Th numeric>Intercept at source (ms)</Th>
                <Th numeric>r²</Th>
                <Th numeric>RMS (ms)</Th>
                <Th>
                  <span className="sr-only">Actions</span>
                </Th>
              </tr>
            </thead>
            <tbody>
              {fits.map((f) => (
                <Tr key={f.id} testId="fit-row">
                  <Td>{f.shotId}</Td>
                  <Td numeric className="whitespace-nowrap">
                    {showMetres(f.fit.xMin)}–{showMetres(f.fit.xMax)}
                  </Td>
                  <Td numeric>{f.fit.n}</Td>
                  <Td numeric className="font-semibold">
                    {showVelocity(f.fit.velocity)}
                  </Td>
                  <Td numeric>{showMs(interceptAtSourceMs(f))}</Td>
                  <Td numeric>{showR2(f.fit.r2)}</Td>
                  <Td numeric>{showMs(f.fit.rmsMs)}</Td>
                  <Td>
                    <button type="button" onClick={() => onFits(fits.filter((g) => g.id !== f.id))} aria-label={`Remove the fit on ${f.shotId}`} className="text-sm font-semibold text-red-800 hover:underline">
                      Remove
                    </button>
                  </Td>
                </Tr>
              ))}
            </tbody>
          </DataTable>
        )}
      </div>
    </div>
  );
}
