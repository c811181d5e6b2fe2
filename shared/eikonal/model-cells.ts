/**
 * The model's cells for the march — slowness per cell and where the contrasts are — kept between
 * solves of the same model (a line's many shots from one solver). When the node slownesses, the
 * interface rule and the contrast ratio are those of the last solve, the cells are not worked out
 * again: only the contrast cells' values are put back and the caller's known cells applied to
 * them (a few thousand cells instead of a pass over the grid and the staircase).
 */
import type { Grid } from '../grid';
import { cellSlowness, type CellSlowness, type InterfaceRule } from './cells';

export class ModelCells {
  private cells: CellSlowness | undefined;
  private rule: InterfaceRule | undefined;
  private ratio = NaN;
  /** Contrast cells of the last full computation and the rule's value on each. */
  private contrastIndex = new Int32Array(0);
  private ruleValue = new Float64Array(0);

  /** `slownessUnchanged`: every node slowness equals that of the previous call (resetNodes tells). */
  update(
    grid: Grid,
    slowness: Float64Array,
    active: Uint8Array,
    slownessUnchanged: boolean,
    rule: InterfaceRule,
    ratio: number,
    known: Float32Array | Float64Array | undefined,
  ): CellSlowness {
    if (!this.cells || !slownessUnchanged || rule !== this.rule || ratio !== this.ratio) {
      this.cells = cellSlowness(grid, slowness, active, rule, ratio, this.cells);
      this.rule = rule;
      this.ratio = ratio;
      this.remember(this.cells);
    }
    const value = this.cells.value;
    const index = this.contrastIndex;
    for (let k = 0; k < index.length; k++) {
      const c = index[k];
      const s = known ? known[c] : NaN;
      value[c] = Number.isFinite(s) ? s : this.ruleValue[k];
    }
    return this.cells;
  }

  get anyContrast(): boolean {
    return this.contrastIndex.length > 0;
  }

  private remember(cells: CellSlowness): void {
    const { value, contrast } = cells;
    let count = 0;
    for (let c = 0; c < contrast.length; c++) count += contrast[c];
    this.contrastIndex = new Int32Array(count);
    this.ruleValue = new Float64Array(count);
    for (let c = 0, k = 0; c < contrast.length; c++) {
      if (contrast[c] === 0) continue;
      this.contrastIndex[k] = c;
      this.ruleValue[k++] = value[c];
    }
  }
}
