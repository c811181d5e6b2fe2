import type { LayerResult } from '../../../shared/layers';
import { layerRows } from './layerInterpretation';

const range = (r: { min: number; max: number } | null) => (r === null ? '—' : `${r.min.toFixed(1)} – ${r.max.toFixed(1)}`);

/** Velocity, depth to the layer's base and thickness per layer, over the geophones with a depth. */
export function LayerTable({ result }: { result: LayerResult }) {
  const rows = layerRows(result);
  return (
    <table data-testid="layer-table" className="w-full max-w-3xl text-left tabular-nums">
      <thead className="border-b border-stone-300 text-sm text-stone-600">
        <tr>
          <th className="py-2 pr-4 font-semibold">Layer</th>
          <th className="py-2 pr-4 font-semibold">Velocity (m/s)</th>
          <th className="py-2 pr-4 font-semibold">Depth to base (m)</th>
          <th className="py-2 font-semibold">Thickness (m)</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.layer} className="border-b border-stone-100">
            <td className="py-2 pr-4">{r.layer === 1 ? "1 (top)" : `${r.layer} (below refractor ${r.layer - 1})`}</td>
            <td className="py-2 pr-4">{Math.round(r.velocity)}</td>
            <td className="py-2 pr-4">{range(r.baseDepth)}</td>
            <td className="py-2">{range(r.thickness)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
