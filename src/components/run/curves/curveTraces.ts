import type { Data } from 'plotly.js';
import type { ResidualRow } from '../../../api/types';
import { plainText } from '../../plot/plainText';
import { shotColour } from '../plot/runChartTheme';
import { compareShotIds } from '../table/residualFilters';

/** Rows of one shot, in receiver order. */
export function groupByShot(rows: readonly ResidualRow[]): { shotId: string; rows: ResidualRow[] }[] {
  const groups = new Map<string, ResidualRow[]>();
  for (const r of rows) {
    const list = groups.get(r.shotId) ?? [];
    list.push(r);
    groups.set(r.shotId, list);
  }
  return [...groups.entries()]
    .sort(([a], [b]) => compareShotIds(a, b))
    .map(([shotId, list]) => ({ shotId, rows: [...list].sort((a, b) => a.receiverX - b.receiverX) }));
}

const hover = (r: ResidualRow) =>
  `shot ${plainText(r.shotId)} · receiver x ${r.receiverX} m<br>observed ${r.observedMs.toFixed(2)} ± ${r.sigmaMs.toFixed(2)} ms<br>computed ${r.computedMs.toFixed(2)} ms<br>residual ${r.residualMs >= 0 ? '+' : ''}${r.residualMs.toFixed(2)} ms${r.excluded ? '<br>excluded from the statistics' : ''}`;

/**
 * Every shot's picks as points with σ bars and its computed times as a line (upper panel, axis y),
 * and its residuals with σ bars (lower panel, axis y2). One legend entry per shot toggles all three.
 */
export function curveTraces(rows: readonly ResidualRow[]): Data[] {
  const traces: Data[] = [];
  groupByShot(rows).forEach(({ shotId, rows: list }, i) => {
    const colour = shotColour(i);
    const used = list.filter((r) => !r.excluded);
    const excluded = list.filter((r) => r.excluded);
    const common = { legendgroup: shotId, hovertemplate: '%{text}<extra></extra>' };
    traces.push({
      ...common,
      type: 'scatter',
      mode: 'lines',
      name: `${plainText(shotId)} computed`,
      showlegend: false,
      x: list.map((r) => r.receiverX),
      y: list.map((r) => r.computedMs),
      text: list.map(hover),
      customdata: list.map((r) => r.pickIndex),
      line: { color: colour, width: 1.8 },
    });
    traces.push({
      ...common,
      type: 'scatter',
      mode: 'markers',
      name: plainText(shotId),
      x: used.map((r) => r.receiverX),
      y: used.map((r) => r.observedMs),
      text: used.map(hover),
      customdata: used.map((r) => r.pickIndex),
      marker: { color: colour, size: 6 },
      error_y: { type: 'data', array: used.map((r) => r.sigmaMs), visible: true, color: colour, thickness: 1, width: 0 },
    } as Data);
    traces.push({
      ...common,
      type: 'scatter',
      mode: 'markers',
      name: `${plainText(shotId)} residuals`,
      showlegend: false,
      xaxis: 'x',
      yaxis: 'y2',
      x: used.map((r) => r.receiverX),
      y: used.map((r) => r.residualMs),
      text: used.map(hover),
      customdata: used.map((r) => r.pickIndex),
      marker: { color: colour, size: 5 },
      error_y: { type: 'data', array: used.map((r) => r.sigmaMs), visible: true, color: colour, thickness: 0.8, width: 0 },
    } as Data);
    if (excluded.length) {
      traces.push({
        ...common,
        type: 'scatter',
        mode: 'markers',
        name: `${plainText(shotId)} excluded`,
        showlegend: false,
        x: excluded.map((r) => r.receiverX),
        y: excluded.map((r) => r.observedMs),
        text: excluded.map(hover),
        customdata: excluded.map((r) => r.pickIndex),
        marker: { color: 'white', size: 7, symbol: 'x-thin-open', line: { color: '#78716c', width: 1.5 } },
      } as Data);
    }
  });
  return traces;
}
