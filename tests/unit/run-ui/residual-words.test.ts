/**
 * Residual wording in a pick's details (issue 17, item 10): nothing definite inside ±1σ, the direction
 * of the model's error only beyond it (common practice, no source: a residual within the pick's own
 * uncertainty carries no information about the model).
 */
import { describe, expect, it } from 'vitest';
import { residualWords } from '../../../src/components/run/misfit/PickDetails';

describe('residualWords', () => {
  it('says nothing definite within ±1σ', () => {
    expect(residualWords(0.1, 0.2)).toMatch(/^Within the pick's uncertainty/);
    expect(residualWords(-0.5, -1)).toMatch(/^Within the pick's uncertainty/);
  });
  it('names the direction beyond 1σ', () => {
    expect(residualWords(1.2, 2.4)).toMatch(/later than computed .* too fast/);
    expect(residualWords(-1.2, -2.4)).toMatch(/earlier than computed .* too slow/);
  });
});
