/**
 * One velocity colour scale across the product (issue 17 item 6): on one range, the same velocity gets
 * the same colour in the model editor's heatmap, the run and inversion sections and the report
 * figures. The scale's shape (lighter = slower, never too dark for black lines) is checked in
 * tests/unit/run-ui/sectionScale.test.ts against the WCAG luminance formula.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_VELOCITY_COLOURS, velocityColour, velocityRangeProblem } from '../../../shared/colour/velocity-scale';
import { lutIndex, VELOCITY_LUT } from '../../../src/components/model/colourScale';
import { velocityPixels } from '../../../src/components/run/section/velocityColours';
import { colourAt, colourText, VELOCITY_STOPS } from '../../../worker/report/colour';

describe('the velocity colour scale', () => {
  const range = { min: 300, max: 4500 };
  const velocities = Array.from({ length: 43 }, (_, k) => 200 + 110 * k); // below, across and above the range

  it('gives the same velocity the same colour in the editor, the sections and the report', () => {
    const pixels = velocityPixels(Float32Array.from(velocities), range);
    velocities.forEach((v, k) => {
      const report = colourAt(VELOCITY_STOPS, (v - range.min) / (range.max - range.min));
      const section = [pixels[4 * k], pixels[4 * k + 1], pixels[4 * k + 2]];
      const i = lutIndex(v, { lo: range.min, hi: range.max });
      const editor = [VELOCITY_LUT[3 * i], VELOCITY_LUT[3 * i + 1], VELOCITY_LUT[3 * i + 2]];
      for (let c = 0; c < 3; c++) {
        expect(Math.abs(section[c] - report[c]), `section, ${v} m/s`).toBeLessThanOrEqual(0.5);
        // The editor's table has 256 entries: at most half a step of the scale apart.
        expect(Math.abs(editor[c] - report[c]), `editor, ${v} m/s`).toBeLessThanOrEqual(1.5);
      }
    });
  });

  it('clips velocities past either end to the end colours', () => {
    expect(velocityColour(100, range)).toEqual(velocityColour(300, range));
    expect(velocityColour(9000, range)).toEqual(velocityColour(4500, range));
    expect(velocityColour(2000, range)).not.toEqual(velocityColour(3000, range));
  });

  it('accepts sensible project ranges and says plainly what is wrong with others', () => {
    expect(velocityRangeProblem(DEFAULT_VELOCITY_COLOURS)).toBeNull();
    expect(velocityRangeProblem({ min: 3000, max: 1000 })).toBe('The fast end of the colour range must be above the slow end.');
    expect(velocityRangeProblem({ min: 10, max: 1000 })).toBe('The colour range must lie between 50 and 10000 m/s.');
    expect(velocityRangeProblem({ min: Number.NaN, max: 1000 })).toBe('Both ends of the colour range must be numbers.');
  });

  it('captions say which scale the colours span and what the section holds', () => {
    expect(colourText({ min: 400, max: 2600 }, { min: 400, max: 2600 }, 'the model')).toBe('Colours give the velocity on one scale from 400 to 2600 m/s.');
    expect(colourText({ min: 200, max: 5000 }, { min: 350, max: 6200 }, 'the model')).toBe(
      "Colours give the velocity on one scale from 200 to 5000 m/s, the project's scale, so the same colour is the same velocity in every section of the project; velocities in the model: 350 to 6200 m/s; velocities beyond the scale take its end colours.",
    );
  });
});
