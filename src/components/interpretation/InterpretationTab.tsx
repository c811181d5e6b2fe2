import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import { errorMessage } from '../../api/errors';
import { lineModelVersions, useModelVersion, useSaveModel } from '../../api/models';
import { usePickSet } from '../../api/picksets';
import { pickSetsInUse, type LineDetail, type PickRow } from '../../api/types';
import { interpretationRecord, layeredModelFromResult, type LayerMethod, type LayerResult } from '../../../shared/layers';
import type { ModelFile } from '../../../shared/model';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import { Loading, LoadError } from '../LoadState';
import { AssignmentChart } from './AssignmentChart';
import { DepthSection } from './DepthSection';
import { InterpretationExports } from './InterpretationExports';
import { SectionColoursControl } from '../plot/colours/SectionColoursControl';
import { useLineSectionColours } from '../plot/colours/useSectionColours';
import { useBoreholes } from '../../api/boreholes';
import { depthBetween } from '../../../shared/boreholes';
import { BoreholeTiesTable } from '../boreholes/BoreholeTiesTable';
import { FunctionsChart } from './FunctionsChart';
import { LayerMethodsCaution } from './LayerMethodsCaution';
import { layerColour, layerName } from './layerColours';
import { LayerTable } from './LayerTable';
import { automaticAssignment, interpret, placeLine, withHandChanges, type LayerSettings, type PlacedLine } from './layerInterpretation';

const METHOD_LABELS: Record<LayerMethod, string> = {
  grm: 'GRM (Palmer)',
  'plus-minus': 'Plus–minus (Hagedoorn)',
  intercept: 'Intercept time',
};

/**
 * Layer methods on a pick set: the picks' assignment to refractors (automatic, changed by clicking
 * picks), the method's check curves, the depth section and layer table, and the result saved as a
 * layered model version. Everything is computed here with shared/layers, the code of `npm run layers`.
 */
export function InterpretationTab({ line, canSave }: { line: LineDetail; canSave: boolean }) {
  const models = lineModelVersions(line.models);
  const pickSets = pickSetsInUse(line.pickSets);
  const [pickSetId, setPickSetId] = useState<string>(pickSets[0]?.id ?? '');
  const [modelId, setModelId] = useState<string>(models[0]?.id ?? '');
  const [settings, setSettings] = useState<LayerSettings>({ method: 'grm', layers: 2, xy: null });
  const [hand, setHand] = useState<ReadonlyMap<number, number>>(new Map());
  const [brush, setBrush] = useState(1);
  const pickSet = usePickSet(pickSetId || null, null);
  const model = useModelVersion(modelId || null);

  if (!pickSets.length) return <p className="text-stone-600">Upload a pick set first: the layer methods work on the picks of a line.</p>;
  if (!models.length) return <p className="text-stone-600">Save a model version first: its grid and ground surface place the picks and carry the result.</p>;

  const choose = (next: Partial<LayerSettings>) => setSettings((s) => ({ ...s, ...next }));
  return (
    <div data-testid="interpretation">
      <LayerMethodsCaution />
      <div className="mb-6 grid grid-cols-1 gap-4 rounded-lg border border-stone-200 bg-white px-5 py-4 sm:grid-cols-2 lg:grid-cols-5">
        <SelectField label="Pick set (latest revision)" value={pickSetId} onChange={(e) => (setPickSetId(e.target.value), setHand(new Map()))} data-testid="layers-pickset">
          {pickSets.map((p) => (
            <option key={p.id} value={p.id}>
              {p.fileName}
            </option>
          ))}
        </SelectField>
        <SelectField label="Grid and ground from" value={modelId} onChange={(e) => setModelId(e.target.value)} data-testid="layers-model">
          {models.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name} v{m.version}
            </option>
          ))}
        </SelectField>
        <SelectField label="Method" value={settings.method} onChange={(e) => choose({ method: e.target.value as LayerMethod, xy: null })} data-testid="layers-method">
          {(Object.keys(METHOD_LABELS) as LayerMethod[]).map((m) => (
            <option key={m} value={m}>
              {METHOD_LABELS[m]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Layers" value={String(settings.layers)} onChange={(e) => (choose({ layers: Number(e.target.value) as 2 | 3 }), setBrush(1))} data-testid="layers-count">
          <option value="2">2 (one refractor)</option>
          <option value="3">3 (two refractors)</option>
        </SelectField>
        <XYField key={settings.method} disabled={settings.method !== 'grm'} value={settings.xy} onChange={(xy) => choose({ xy })} />
      </div>
      {pickSet.isPending || model.isPending ? (
        <Loading what="picks and model" />
      ) : pickSet.isError ? (
        <LoadError error={pickSet.error} what="pick set" onRetry={() => void pickSet.refetch()} />
      ) : model.isError ? (
        <LoadError error={model.error} what="model version" onRetry={() => void model.refetch()} />
      ) : (
        <Interpretation
          key={`${pickSetId}:${modelId}`}
          picks={pickSet.data.picks}
          model={model.data.model}
          modelId={modelId}
          pickSetName={`${pickSet.data.fileName} revision ${pickSet.data.revision.number}`}
          settings={settings}
          hand={hand}
          onHand={setHand}
          brush={brush}
          onBrush={setBrush}
          lineId={line.id}
          canSave={canSave}
        />
      )}
    </div>
  );
}

function XYField({ value, disabled, onChange }: { value: number | null; disabled: boolean; onChange: (xy: number | null) => void }) {
  const [text, setText] = useState(value === null ? '' : String(value));
  const parsed = text.trim() === '' ? null : Number(text);
  const bad = parsed !== null && !(Number.isFinite(parsed) && parsed >= 0);
  return (
    <TextField
      label="XY (m)"
      hint={disabled ? 'GRM only' : 'empty: the optimum'}
      inputMode="decimal"
      value={text}
      disabled={disabled}
      error={bad ? 'a distance of 0 m or more' : undefined}
      onChange={(e) => setText(e.target.value)}
      onBlur={() => !bad && onChange(parsed)}
      onKeyDown={(e) => e.key === 'Enter' && !bad && onChange(parsed)}
      data-testid="layers-xy"
    />
  );
}

interface InterpretationProps {
  picks: PickRow[];
  model: ModelFile;
  modelId: string;
  pickSetName: string;
  settings: LayerSettings;
  hand: ReadonlyMap<number, number>;
  onHand: (hand: ReadonlyMap<number, number>) => void;
  brush: number;
  onBrush: (layer: number) => void;
  lineId: string;
  canSave: boolean;
}

function Interpretation({ picks, model, modelId, pickSetName, settings, hand, onHand, brush, onBrush, lineId, canSave }: InterpretationProps) {
  const placement = useMemo(() => placeLine(picks, model), [picks, model]);
  const automatic = useMemo(() => (placement.ok ? automaticAssignment(placement.line, settings.layers) : null), [placement, settings.layers]);
  const assignment = useMemo(() => (placement.ok && automatic ? withHandChanges(automatic, placement.line, hand, settings.layers) : null), [placement, automatic, hand, settings.layers]);
  const outcome = useMemo(() => (placement.ok && assignment ? interpret(placement.line, hand.size ? assignment : null, settings) : null), [placement, assignment, hand, settings]);

  if (!placement.ok) return <Problem text={placement.message} />;
  const pl = placement.line;
  const setPick = (index: number) => {
    const next = new Map(hand);
    next.set(index, brush);
    onHand(next);
  };
  return (
    <>
      <section className="mb-8">
        <h3 className="mb-1 text-lg font-semibold">Which layer each pick travelled in</h3>
        <p className="mb-3 max-w-prose text-stone-700">
          The first suggestion comes from the slope breaks of each curve. Choose a layer below, then click picks to give them that layer.
        </p>
        <div className="mb-3 flex flex-wrap items-center gap-2" role="radiogroup" aria-label="Layer given to clicked picks">
          {[...Array.from({ length: settings.layers }, (_, k) => k), -1].map((k) => (
            <button
              key={k}
              type="button"
              role="radio"
              aria-checked={brush === k}
              onClick={() => onBrush(k)}
              data-testid={`layers-brush-${k}`}
              className={`flex items-center gap-2 rounded-md border px-3 py-1 text-sm font-semibold ${brush === k ? 'border-stone-800 bg-stone-800 text-white' : 'border-stone-300 bg-white text-stone-800 hover:border-stone-500'}`}
            >
              <span aria-hidden className="inline-block h-3 w-3 rounded-full" style={{ background: layerColour(k) }} />
              {layerName(k)}
            </button>
          ))}
          <Button variant="secondary" size="sm" disabled={hand.size === 0} onClick={() => onHand(new Map())} data-testid="layers-reset">
            Back to the automatic assignment{hand.size ? ` (${hand.size} changed)` : ''}
          </Button>
        </div>
        {assignment && <AssignmentChart line={pl} assignment={assignment} layers={settings.layers} onPick={setPick} />}
      </section>
      {outcome && !outcome.ok && <Problem text={outcome.message} />}
      {outcome?.ok && <Result result={outcome.result} line={pl} model={model} modelId={modelId} pickSetName={pickSetName} lineId={lineId} canSave={canSave} handChanges={hand.size} />}
    </>
  );
}

function Problem({ text }: { text: string }) {
  return (
    <p role="alert" data-testid="layers-problem" className="mb-6 rounded-lg border border-red-300 bg-red-50 px-5 py-3 text-red-900">
      {text}
    </p>
  );
}

function Result({ result, line, model, modelId, pickSetName, lineId, canSave, handChanges }: { result: LayerResult; line: PlacedLine; model: ModelFile; modelId: string; pickSetName: string; lineId: string; canSave: boolean; handChanges: number }) {
  const geophones = [...new Set(result.depths.map((d) => d.x))].sort((a, b) => a - b);
  const ground = useMemo(() => {
    const xs = [...new Set([...line.placed.flatMap((s) => s.picks.map((_, i) => s.receivers[2 * i])), ...line.placed.map((s) => s.source.x)])].sort((a, b) => a - b);
    return { x: xs, z: xs.map(line.surfaceZ) };
  }, [line]);
  const shots = useMemo(() => line.placed.map((s) => ({ x: s.source.x, z: s.source.z, id: s.shotId })), [line]);
  const refractors = result.velocities.length - 1;
  const holes = useBoreholes(lineId);
  const ownRange = useMemo(() => ({ min: Math.min(...result.velocities), max: Math.max(...result.velocities) }), [result]);
  const colours = useLineSectionColours(lineId, ownRange);
  // Ties to the logs: the deepest refractor, between the geophones where it was interpreted.
  const rockTop = useMemo(() => (refractors > 0 ? depthBetween(result.depths.filter((d) => d.refractor === refractors)) : null), [result, refractors]);
  return (
    <section data-testid="layers-result">
      <h3 className="mb-2 text-lg font-semibold">Result</h3>
      <p data-testid="layers-summary" className="mb-3">
        Velocities {result.velocities.map((v) => `${Math.round(v)} m/s`).join(' over ')}; depths under {geophones.length} geophones
        {result.xy !== null ? `; optimum XY ${result.xy.toFixed(2)} m (smallest scatter of the velocity-analysis functions about straight lines)` : ''}.
      </p>
      {result.warnings.length > 0 && (
        <ul data-testid="layers-warnings" className="mb-4 list-disc space-y-1 rounded-lg border border-amber-300 bg-amber-50 py-3 pl-9 pr-5 text-amber-950">
          {result.warnings.map((w) => (
            <li key={w}>{w[0].toUpperCase() + w.slice(1)}.</li>
          ))}
        </ul>
      )}
      <div className="mb-6">
        <LayerTable result={result} />
      </div>
      <div className="mb-1 flex flex-wrap items-end justify-between gap-3">
        <h4 className="font-semibold">Depth section (true scale)</h4>
        <SectionColoursControl colours={colours} testId="layers-colours" />
      </div>
      <DepthSection result={result} ground={ground} shots={shots} holes={holes.data ?? []} colourRange={colours.range} />
      {rockTop && <BoreholeTiesTable holes={holes.data ?? []} depthAt={rockTop} surfaceName={`refractor ${refractors} (${Math.round(result.velocities[refractors])} m/s)`} />}
      {result.method !== 'intercept' &&
        Array.from({ length: refractors }, (_, k) => (
          <div key={k} className="mt-6">
            <h4 className="mb-1 font-semibold">
              Refractor {k + 1}: velocity analysis and time-depths{result.functions[k] ? ` at XY ${result.functions[k].xy.toFixed(2)} m` : ''}
            </h4>
            <FunctionsChart result={result} refractor={k + 1} />
          </div>
        ))}
      <DepthTable result={result} />
      <SaveAsModel result={result} model={model} modelId={modelId} lineId={lineId} canSave={canSave} picks={pickSetName} handChanges={handChanges} />
    </section>
  );
}

function DepthTable({ result }: { result: LayerResult }) {
  const rows = [...result.depths].sort((a, b) => a.refractor - b.refractor || a.x - b.x);
  return (
    <details className="mt-6">
      <summary className="cursor-pointer font-semibold">Depth under each geophone ({rows.length} rows)</summary>
      <div className="mt-2 max-h-96 overflow-auto">
        <table data-testid="layers-depths" className="w-full max-w-3xl text-left text-sm tabular-nums">
          <thead className="sticky top-0 bg-white text-stone-600">
            <tr>
              <th className="py-1 pr-4">x (m)</th>
              <th className="py-1 pr-4">Ground (m)</th>
              <th className="py-1 pr-4">Refractor</th>
              <th className="py-1 pr-4">Depth (m)</th>
              <th className="py-1">Elevation (m)</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((d) => (
              <tr key={`${d.refractor}:${d.x}`} className="border-t border-stone-100">
                <td className="py-1 pr-4">{d.x.toFixed(2)}</td>
                <td className="py-1 pr-4">{d.groundZ.toFixed(2)}</td>
                <td className="py-1 pr-4">{d.refractor}</td>
                <td className="py-1 pr-4">{d.depth.toFixed(2)}</td>
                <td className="py-1">{d.refractorZ.toFixed(2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

function SaveAsModel({ result, model, modelId, lineId, canSave, picks, handChanges }: { result: LayerResult; model: ModelFile; modelId: string; lineId: string; canSave: boolean; picks: string; handChanges: number }) {
  const comment = `${result.method} on ${picks}${handChanges ? `, ${handChanges} picks assigned by hand` : ''}`;
  // The record of how it was made travels in the model file, so a report on the model can show it.
  const layered = () => ({ ...layeredModelFromResult(result, model), interpretation: interpretationRecord(result, picks, handChanges) });
  const save = useSaveModel(lineId);
  const [name, setName] = useState('layers');
  const files = <InterpretationExports lineId={lineId} model={layered} method={result.method} />;
  if (!canSave) {
    return (
      <>
        <p className="mt-6 text-stone-600">A geophysicist can save this interpretation as a layered model version of the line.</p>
        {files}
      </>
    );
  }
  if (save.data) {
    return (
      <p data-testid="layers-saved" className="mt-6 rounded-lg border border-emerald-300 bg-emerald-50 px-5 py-3 text-emerald-950">
        Saved as {save.data.name ?? name} version {save.data.version}.{' '}
        <Link to={`/models/${save.data.id}`} className="font-semibold" data-testid="layers-model-link">
          Open the model
        </Link>{' '}
        to run it forward or start an inversion from it.
      </p>
    );
  }
  const form = (
    <div className="mt-6 flex flex-wrap items-end gap-4 rounded-lg border border-stone-200 bg-white px-5 py-4">
      <TextField label="Model name" value={name} onChange={(e) => setName(e.target.value)} maxLength={80} data-testid="layers-model-name" />
      <Button
        onClick={() => save.mutate({ model: layered(), name: name.trim() || 'layers', comment, basedOn: modelId })}
        busy={save.isPending}
        busyLabel="Saving…"
        data-testid="layers-save"
      >
        Save as layered model version
      </Button>
      <span className="max-w-prose text-sm text-stone-600">Interfaces from the depths under the geophones, carried flat beyond them; the layer velocities as found. Same grid and ground as the chosen model.</span>
      {save.isError && (
        <p role="alert" className="w-full text-sm font-semibold text-red-800">
          The model could not be saved: {errorMessage(save.error)}
        </p>
      )}
    </div>
  );
  return (
    <>
      {form}
      {files}
    </>
  );
}
