/**
 * Issue 16 item 16: user text in charts is text, never markup. Plotly reads names, hover
 * templates, point text and annotations as an HTML dialect (plotly.js docs: "text" and
 * "hovertemplate" accept <br>, <b>, <a href>), so a shot id such as <a href=…> must reach it
 * escaped: & → &amp;, < → &lt;, > → &gt; (the HTML character references, WHATWG HTML §13.5).
 */
import { describe, expect, it } from 'vitest';
import { travelTimeCurves } from '../../../shared/qc';
import { chartTraces } from '../../../src/components/line/checks/chartTraces';
import { curveTraces } from '../../../src/components/run/curves/curveTraces';
import { plainText } from '../../../src/components/plot/plainText';
import type { PickRow } from '../../../src/api/types';
import { row } from '../run-ui/fixtures';

const EVIL = '<a href="https://example.invalid/x">S1</a>';

/** Keys plotly never draws (identifiers only): the raw id may stay there. */
const NOT_DRAWN = new Set(['meta', 'legendgroup']);

/** Every string plotly may draw, anywhere in a data/layout value. */
function strings(v: unknown, out: string[] = []): string[] {
  if (typeof v === 'string') out.push(v);
  else if (Array.isArray(v)) v.forEach((x) => strings(x, out));
  else if (v && typeof v === 'object' && !ArrayBuffer.isView(v)) Object.entries(v).forEach(([k, x]) => !NOT_DRAWN.has(k) && strings(x, out));
  return out;
}

describe('plainText', () => {
  it('escapes &, < and > and leaves other text alone', () => {
    expect(plainText(EVIL)).toBe('&lt;a href="https://example.invalid/x"&gt;S1&lt;/a&gt;');
    expect(plainText('A&B <1>')).toBe('A&amp;B &lt;1&gt;');
    expect(plainText('S01 ↔ S02')).toBe('S01 ↔ S02');
  });
});

describe('charts escape user shot ids', () => {
  it('pick-check chart: no tag from a shot id survives in any name, text or hover template', () => {
    const picks: PickRow[] = [0, 5, 10].map((x, i) => ({
      index: i, line: i + 2, shotId: EVIL, sourceX: 0, sourceZ: null, receiverX: x, receiverZ: null, timeMs: x * 2, sigmaMs: 0.5, excluded: false, exclusionReason: null,
    }));
    const curves = travelTimeCurves(picks.map((p) => ({ index: p.index, shotId: p.shotId, sourceX: p.sourceX, receiverX: p.receiverX, time: p.timeMs / 1000, sigma: 0.0005 })));
    const fit = { shotId: EVIL, fit: { velocity: 500, slope: 0.002, intercept: 0, xMin: 0, xMax: 10, n: 3, r2: 1, rmsMs: 0 } };
    const traces = chartTraces({
      curves, picksByIndex: new Map(picks.map((p) => [p.index, p])), excluded: new Set(), hidden: new Set(), flags: [],
      pairs: [{ shotA: EVIL, shotB: EVIL, indexAB: 0, indexBA: 1, tAB: 0.01, tBA: 0.01, difference: 0, flagged: false } as never],
      fits: [fit as never], selected: new Set(),
    });
    const all = strings(traces);
    expect(all.some((s) => /<a/i.test(s))).toBe(false);
    expect(all).toContain(plainText(EVIL)); // the shot's trace name, escaped
    // The legend toggle still gets the raw id.
    expect((traces[0] as { meta?: string }).meta).toBe(EVIL);
  });

  it('run travel-time curves: names and hover text are escaped, our own <br> stays', () => {
    const traces = curveTraces([row({ shotId: EVIL, receiverX: 5 }), row({ shotId: EVIL, receiverX: 10, pickIndex: 1 })]);
    const all = strings(traces);
    expect(all.some((s) => /<a/i.test(s))).toBe(false);
    expect(all.some((s) => s.startsWith(`shot ${plainText(EVIL)} · receiver x 5 m<br>`))).toBe(true);
  });
});
