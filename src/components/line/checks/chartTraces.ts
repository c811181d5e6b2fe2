import type { PickRow } from '../../../api/types';
import type { PickFlag, ReciprocalPair, TravelTimeCurve } from '../../../../shared/qc';
import { plainText } from '../../plot/plainText';
import { shotColour } from '../plot/chartTheme';
import type { KeptFit } from './fits';
import { showVelocity } from './numbers';
import { SUSPECT_LABELS } from './qcPicks';

/**
 * The plotly traces of the travel-time chart, built from the picks and the QC results. Pure, so
 * the chart can memoise it: plotly redraws only when one of these inputs actually changes.
 */

export interface ChartInput {
  curves: readonly TravelTimeCurve[];
  picksByIndex: ReadonlyMap<number, PickRow>;
  excluded: ReadonlySet<number>;
  hidden: ReadonlySet<string>;
  flags: readonly PickFlag[];
  pairs: readonly ReciprocalPair[];
  fits: readonly KeptFit[];
  selected: ReadonlySet<number>;
}

/** Dragging a fit range selects points; keep every point fully drawn rather than dimming the rest. */
const KEEP = { marker: { opacity: 1 } };

/** Above this many points SVG gets sluggish; WebGL draws the same chart. */
const GL_THRESHOLD = 20_000;

export const OVERLAY = {
  excluded: 'Excluded picks',
  suspect: 'Suspect picks',
  pairOk: 'Reciprocal pairs within tolerance',
  pairBad: 'Reciprocal pairs over tolerance',
  selected: 'Selected picks',
  shots: 'Shot positions',
} as const;

export function chartTraces({ curves, picksByIndex, excluded, hidden, flags, pairs, fits, selected }: ChartInput): object[] {
  const total = curves.reduce((n, c) => n + c.x.length, 0);
  const scatter = total > GL_THRESHOLD ? 'scattergl' : 'scatter';
  const vis = (name: string) => (hidden.has(name) ? 'legendonly' : true);
  const at = (indices: Iterable<number>) => {
    const xs: number[] = [];
    const ys: number[] = [];
    const ids: number[] = [];
    for (const i of indices) {
      const p = picksByIndex.get(i);
      if (!p) continue;
      xs.push(p.receiverX);
      ys.push(p.timeMs);
      ids.push(i);
    }
    return { xs, ys, ids };
  };

  const shotTraces = curves.map((c, k) => {
    const keep: number[] = [];
    for (let j = 0; j < c.x.length; j++) if (!excluded.has(c.index[j])) keep.push(j);
    return {
      type: scatter,
      mode: 'lines+markers',
      // Shot ids are user text: escaped for plotly; `meta` keeps the raw id for the legend toggle.
      name: plainText(c.shotId),
      meta: c.shotId,
      visible: vis(c.shotId),
      x: keep.map((j) => c.x[j]),
      y: keep.map((j) => c.t[j] * 1000),
      customdata: keep.map((j) => c.index[j]),
      line: { color: shotColour(k), width: 1.5 },
      marker: { color: shotColour(k), size: 6 },
      unselected: KEEP,
      selected: KEEP,
      hovertemplate: `shot ${plainText(c.shotId)}<br>x %{x} m<br>t %{y:.2f} ms<extra></extra>`,
    };
  });

  const ex = at(excluded);
  const suspect = at(flags.map((f) => f.index));
  const flagKind = new Map(flags.map((f) => [f.index, SUSPECT_LABELS[f.kind]]));
  const pairPoints = (flagged: boolean) => {
    const list = pairs.filter((p) => p.flagged === flagged);
    const pts = at(list.flatMap((p) => [p.indexAB, p.indexBA]));
    const text = list.flatMap((p) => {
      const t = `${plainText(p.shotA)} ↔ ${plainText(p.shotB)}: |Δt| ${(p.difference * 1000).toFixed(2)} ms`;
      return [t, t];
    });
    return { ...pts, text };
  };
  const pairOk = pairPoints(false);
  const pairBad = pairPoints(true);
  const sel = at(selected);

  const marks = (name: string, pts: { xs: number[]; ys: number[]; ids: number[]; text?: string[] }, marker: object, hovertemplate: string) => ({
    type: scatter,
    mode: 'markers',
    name,
    meta: name,
    visible: vis(name),
    x: pts.xs,
    y: pts.ys,
    customdata: pts.ids,
    text: pts.text,
    marker,
    hovertemplate,
    unselected: KEEP,
    selected: KEEP,
  });
  const where = 'x %{x} m<br>t %{y:.2f} ms<extra></extra>';

  const overlays = [
    marks(OVERLAY.excluded, ex, { symbol: 'x-thin-open', size: 9, color: '#78716c', line: { width: 2, color: '#78716c' } }, `excluded pick<br>${where}`),
    marks(OVERLAY.suspect, { ...suspect, text: suspect.ids.map((i) => flagKind.get(i) ?? '') }, { symbol: 'circle-open', size: 14, color: '#b91c1c', line: { width: 2 } }, `suspect: %{text}<br>${where}`),
    marks(OVERLAY.pairOk, pairOk, { symbol: 'diamond-open', size: 11, color: '#57534e', line: { width: 1.5 } }, '%{text}<extra></extra>'),
    marks(OVERLAY.pairBad, pairBad, { symbol: 'diamond-open', size: 15, color: '#b45309', line: { width: 2.5 } }, '%{text}<extra></extra>'),
    { ...marks(OVERLAY.selected, sel, { symbol: 'square-open', size: 13, color: '#1f5d57', line: { width: 2 } }, `selected pick<br>${where}`), showlegend: sel.ids.length > 0 },
    // Shot positions sit on a hidden second axis pinned to the foot of the chart, so they never hide picks.
    {
      type: 'scatter',
      mode: curves.length <= 16 ? 'markers+text' : 'markers',
      unselected: { marker: { opacity: 1 }, textfont: { color: '#44403c' } },
      name: OVERLAY.shots,
      meta: OVERLAY.shots,
      visible: vis(OVERLAY.shots),
      yaxis: 'y2',
      x: curves.map((c) => c.sourceX),
      y: curves.map(() => 0.012),
      text: curves.map((c) => plainText(c.shotId)),
      textposition: 'top center',
      textfont: { size: 12, color: '#44403c' },
      marker: { symbol: 'star', size: 13, color: curves.map((_, k) => shotColour(k)), line: { width: 1, color: '#292524' } },
      hovertemplate: 'shot %{text}<br>source x %{x} m<extra></extra>',
      cliponaxis: false,
    },
  ];

  const fitTraces = fits.map((f) => ({
    type: 'scatter',
    mode: 'lines',
    name: `${plainText(f.shotId)}: ${showVelocity(f.fit.velocity)} m/s`,
    showlegend: false,
    x: [f.fit.xMin, f.fit.xMax],
    y: [f.fit.xMin, f.fit.xMax].map((x) => (f.fit.intercept + f.fit.slope * x) * 1000),
    line: { color: '#1c1917', width: 2.5, dash: 'dash' },
    hovertemplate: `fit on ${plainText(f.shotId)}: ${showVelocity(f.fit.velocity)} m/s<extra></extra>`,
  }));

  return [...shotTraces, ...overlays, ...fitTraces];
}

export function fitAnnotations(fits: readonly KeptFit[]): object[] {
  return fits.map((f) => {
    const xm = (f.fit.xMin + f.fit.xMax) / 2;
    return {
      x: xm,
      y: (f.fit.intercept + f.fit.slope * xm) * 1000,
      text: `<b>${showVelocity(f.fit.velocity)} m/s</b>`,
      showarrow: false,
      yshift: 14,
      bgcolor: 'rgba(255,255,255,0.85)',
      bordercolor: '#a8a29e',
      borderpad: 2,
      font: { size: 13, color: '#1c1917' },
    };
  });
}

