/**
 * Layers top-down with name and velocities at the layer's top and base, and the selected
 * layer's base nodes below. Inputs are marked with the checks' messages for their JSON path.
 */
import type { ModelLayer } from '../../../shared/model';
import { canDeleteNode, type Point } from '../../../shared/model/edit';
import { Button } from '../Button';
import { NumberInput, TextInput } from './NumberInput';

export interface LayerTableProps {
  layers: readonly ModelLayer[];
  readOnly: boolean;
  selectedLayer: number | null;
  selectedNode: number | null;
  issues: ReadonlyMap<string, string>;
  onSelect: (layer: number | null, node: number | null) => void;
  onChangeLayer: (k: number, patch: Partial<ModelLayer>) => void;
  onAddBelow: (k: number) => void;
  onRemove: (k: number) => void;
  onMoveNode: (k: number, i: number, x: number, z: number) => void;
  onAddNode: (k: number) => void;
  onDeleteNode: (k: number, i: number) => void;
}

const th = 'border-b border-stone-300 bg-stone-100 px-2 py-2 text-left text-sm font-semibold text-stone-700';
const td = 'px-2 py-1.5 align-middle';

export function LayerTable(p: LayerTableProps) {
  const sel = p.selectedLayer !== null && p.selectedLayer < p.layers.length ? p.selectedLayer : null;
  const base = sel !== null ? (p.layers[sel].base as Point[] | undefined) : undefined;
  return (
    <div>
      <div className="relative overflow-x-auto rounded-lg border border-stone-200 bg-white">
        <table data-testid="layer-table" className="w-full border-collapse" style={{ minWidth: '34rem' }}>
          <caption className="sr-only">Layers from the ground surface down</caption>
          <thead>
            <tr>
              <th scope="col" className={th}>Layer</th>
              <th scope="col" className={th}>Name</th>
              <th scope="col" className={`${th} text-right`}>v top (m/s)</th>
              <th scope="col" className={`${th} text-right`}>v base (m/s)</th>
              <th scope="col" className={th}>Base</th>
              {!p.readOnly && <th scope="col" className={th}><span className="sr-only">Actions</span></th>}
            </tr>
          </thead>
          <tbody>
            {p.layers.map((layer, k) => {
              const last = k === p.layers.length - 1;
              const selected = k === sel;
              return (
                <tr key={k} data-testid={`layer-row-${k}`} className={`border-b border-stone-200 last:border-b-0 ${selected ? 'bg-accent-50' : 'even:bg-stone-50'}`}>
                  <td className={td}>
                    <button
                      type="button"
                      aria-pressed={selected}
                      onClick={() => p.onSelect(selected ? null : k, null)}
                      className={`rounded-md px-2 py-0.5 font-semibold ${selected ? 'bg-accent-700 text-white' : 'text-accent-700 hover:bg-accent-50'}`}
                    >
                      {k + 1}
                    </button>
                  </td>
                  <td className={td}>
                    <TextInput className="min-w-40" aria-label={`Layer ${k + 1} name`} value={layer.name ?? ''} disabled={p.readOnly} onCommit={(name) => p.onChangeLayer(k, { name })} />
                  </td>
                  <td className={`${td} text-right`}>
                    <NumberInput
                      className="w-20"
                      aria-label={`Layer ${k + 1} velocity at top (m/s)`}
                      value={layer.v_top}
                      disabled={p.readOnly}
                      invalid={p.issues.get(`layers[${k}].v_top`)}
                      onCommit={(v_top) => p.onChangeLayer(k, { v_top })}
                    />
                  </td>
                  <td className={`${td} text-right`}>
                    <NumberInput
                      className="w-20"
                      aria-label={`Layer ${k + 1} velocity at base (m/s)`}
                      value={layer.v_base}
                      disabled={p.readOnly}
                      invalid={p.issues.get(`layers[${k}].v_base`)}
                      onCommit={(v_base) => p.onChangeLayer(k, { v_base })}
                    />
                  </td>
                  <td className={`${td} text-sm text-stone-700`}>
                    {last ? 'grid bottom' : `${layer.base?.length ?? 0} nodes`}
                  </td>
                  {!p.readOnly && (
                    <td className={`${td} whitespace-nowrap text-right`}>
                      <Button size="sm" variant="quiet" onClick={() => p.onAddBelow(k)} aria-label={`Add a layer below layer ${k + 1}`}>
                        Add below
                      </Button>
                      <Button size="sm" variant="quiet" disabled={p.layers.length <= 1} onClick={() => p.onRemove(k)} aria-label={`Remove layer ${k + 1}`}>
                        Remove
                      </Button>
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-sm text-stone-600">
        Velocity changes linearly with depth inside each layer. Choose a layer to edit its base nodes here or on the section.
      </p>
      {sel !== null && base && (
        <NodeTable
          layerName={p.layers[sel].name || `layer ${sel + 1}`}
          k={sel}
          points={base}
          readOnly={p.readOnly}
          selectedNode={p.selectedNode}
          issues={p.issues}
          onSelect={(i) => p.onSelect(sel, i)}
          onMove={(i, x, z) => p.onMoveNode(sel, i, x, z)}
          onAdd={() => p.onAddNode(sel)}
          onDelete={(i) => p.onDeleteNode(sel, i)}
        />
      )}
      {sel !== null && !base && <p className="mt-3 text-sm text-stone-600">The last layer has no base: it reaches the bottom of the grid.</p>}
    </div>
  );
}

function NodeTable(p: {
  layerName: string;
  k: number;
  points: Point[];
  readOnly: boolean;
  selectedNode: number | null;
  issues: ReadonlyMap<string, string>;
  onSelect: (i: number) => void;
  onMove: (i: number, x: number, z: number) => void;
  onAdd: () => void;
  onDelete: (i: number) => void;
}) {
  return (
    <div className="mt-4">
      <div className="mb-2 flex items-center justify-between gap-3">
        <h3 className="font-semibold text-stone-900">Base of “{p.layerName}”</h3>
        {!p.readOnly && (
          <Button size="sm" variant="secondary" onClick={p.onAdd}>
            Add node
          </Button>
        )}
      </div>
      <div className="max-h-80 overflow-y-auto rounded-lg border border-stone-200 bg-white">
        <table data-testid="node-table" className="w-full border-collapse">
          <caption className="sr-only">Nodes of the base of {p.layerName}</caption>
          <thead className="sticky top-0">
            <tr>
              <th scope="col" className={th}>Node</th>
              <th scope="col" className={`${th} text-right`}>x (m)</th>
              <th scope="col" className={`${th} text-right`}>z (m)</th>
              {!p.readOnly && <th scope="col" className={th}><span className="sr-only">Actions</span></th>}
            </tr>
          </thead>
          <tbody>
            {p.points.map(([x, z], i) => {
              const pinned = i === 0 || i === p.points.length - 1;
              const issue = p.issues.get(`layers[${p.k}].base[${i}]`);
              return (
                <tr key={i} className={`border-b border-stone-200 last:border-b-0 ${i === p.selectedNode ? 'bg-yellow-50' : ''}`} onFocus={() => p.onSelect(i)}>
                  <td className={`${td} text-sm`}>{i + 1}</td>
                  <td className={`${td} text-right`}>
                    <NumberInput
                      aria-label={`Node ${i + 1} x (m)`}
                      value={x}
                      disabled={p.readOnly || pinned}
                      title={pinned ? 'End nodes stay at the grid edges so the boundary covers the grid' : undefined}
                      invalid={issue}
                      onCommit={(nx) => p.onMove(i, nx, z)}
                    />
                  </td>
                  <td className={`${td} text-right`}>
                    <NumberInput aria-label={`Node ${i + 1} z (m)`} value={z} disabled={p.readOnly} invalid={issue} onCommit={(nz) => p.onMove(i, x, nz)} />
                  </td>
                  {!p.readOnly && (
                    <td className={`${td} text-right`}>
                      <Button size="sm" variant="quiet" disabled={!canDeleteNode(p.points, i)} onClick={() => p.onDelete(i)} aria-label={`Delete node ${i + 1}`}>
                        Delete
                      </Button>
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
