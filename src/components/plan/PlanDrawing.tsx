import { useMemo } from 'react';
import type { ExportStation } from '../../../shared/exports/section';
import { mapPositionAt } from '../../../shared/exports/along-line';
import { mappedLines, planExtent, scaleBarLength, type Plan } from '../../../shared/exports/plan-geometry';

const COLOURS = { line: '#1c1917', station: '#15803d', shot: '#b91c1c', hole: '#1c1917', text: '#292524' };
const W = 900, H = 560, PAD = 60;

/**
 * The project's lines in plan, in its map grid, drawn as SVG (no map tiles: nothing leaves the
 * browser and it works offline): each line through its stations, shots and holes placed by
 * chainage, a north arrow (grid north) and a scale bar. x grows east, y north, at one scale.
 */
export function PlanDrawing({ plan }: { plan: Plan }) {
  const lines = useMemo(() => mappedLines(plan), [plan]);
  if (!lines.length) return null;
  const ext = planExtent(lines);
  const span = Math.max(ext.e1 - ext.e0, ext.n1 - ext.n0, 10) * 1.15;
  const s = Math.min((W - 2 * PAD) / span, (H - 2 * PAD) / span);
  const ce = (ext.e0 + ext.e1) / 2, cn = (ext.n0 + ext.n1) / 2;
  const px = (e: number) => W / 2 + (e - ce) * s;
  const py = (n: number) => H / 2 - (n - cn) * s;
  const at = (stations: ExportStation[], x: number) => mapPositionAt(stations, x);
  const bar = scaleBarLength(span);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full max-w-4xl rounded-lg border border-stone-200 bg-white" role="img" aria-label={`Plan of ${lines.length} survey line${lines.length === 1 ? '' : 's'}`} data-testid="plan-drawing">
      {lines.map((line) => {
        const pts = line.stations.filter((st) => st.easting !== undefined);
        return (
          <g key={line.id} data-testid="plan-line">
            <polyline points={pts.map((st) => `${px(st.easting!)},${py(st.northing!)}`).join(' ')} fill="none" stroke={COLOURS.line} strokeWidth={2} />
            {pts.map((st) => (
              <circle key={String(st.station)} cx={px(st.easting!)} cy={py(st.northing!)} r={2.5} fill={COLOURS.station}>
                <title>{`Station ${st.station}: x ${st.x} m, E ${st.easting!.toFixed(2)}, N ${st.northing!.toFixed(2)}`}</title>
              </circle>
            ))}
            <text x={px(pts[0].easting!) - 8} y={py(pts[0].northing!) - 10} fontSize={14} fontWeight={600} fill={COLOURS.text} textAnchor="end">
              {line.name}
            </text>
            {line.shots.map((sh) => {
              const p = at(line.stations, sh.x);
              return p ? (
                <path key={sh.id} d={`M ${px(p[0])} ${py(p[1]) - 7} L ${px(p[0]) + 6} ${py(p[1]) + 4} L ${px(p[0]) - 6} ${py(p[1]) + 4} Z`} fill={COLOURS.shot}>
                  <title>{`Shot ${sh.id} at x ${sh.x} m`}</title>
                </path>
              ) : null;
            })}
            {line.holes.map((hole) => {
              const p = at(line.stations, hole.x);
              return p ? (
                <g key={hole.name}>
                  <rect x={px(p[0]) - 5} y={py(p[1]) - 5} width={10} height={10} fill="white" stroke={COLOURS.hole} strokeWidth={2} />
                  <text x={px(p[0]) + 8} y={py(p[1]) + 18} fontSize={12} fill={COLOURS.text}>
                    {hole.name}
                  </text>
                </g>
              ) : null;
            })}
          </g>
        );
      })}
      <g aria-label="North arrow" transform={`translate(${W - 40}, 50)`}>
        <path d="M 0 -28 L 9 8 L 0 2 L -9 8 Z" fill={COLOURS.text} />
        <text y={26} fontSize={14} fontWeight={700} textAnchor="middle" fill={COLOURS.text}>
          N
        </text>
      </g>
      <g aria-label={`Scale bar ${bar} m`} transform={`translate(${PAD}, ${H - 28})`}>
        <line x1={0} x2={bar * s} y1={0} y2={0} stroke={COLOURS.text} strokeWidth={3} />
        <line x1={0} x2={0} y1={-6} y2={6} stroke={COLOURS.text} strokeWidth={2} />
        <line x1={bar * s} x2={bar * s} y1={-6} y2={6} stroke={COLOURS.text} strokeWidth={2} />
        <text x={(bar * s) / 2} y={-10} fontSize={13} textAnchor="middle" fill={COLOURS.text}>
          {bar} m
        </text>
      </g>
      <g transform={`translate(${W - 250}, ${H - 28})`} fontSize={12} fill={COLOURS.text}>
        <circle cx={0} cy={-4} r={3} fill={COLOURS.station} />
        <text x={8} y={0}>station</text>
        <path d="M 70 -11 L 76 0 L 64 0 Z" fill={COLOURS.shot} />
        <text x={82} y={0}>shot</text>
        <rect x={125} y={-9} width={10} height={10} fill="white" stroke={COLOURS.hole} strokeWidth={2} />
        <text x={141} y={0}>borehole / pit</text>
      </g>
    </svg>
  );
}
