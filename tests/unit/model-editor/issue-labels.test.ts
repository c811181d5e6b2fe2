/**
 * Model checks named as the editor labels the fields (issue 17, item 10): the file format's JSON path
 * (FORMATS.md §1) becomes "Layer 2 “weathered”, velocity at top", and the message drops the key it
 * repeats. Wording is the product's own (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { fieldLabel, plainIssue } from '../../../src/components/model/issueLabels';

const model = { layers: [{ name: 'topsoil', v_top: 400, v_base: 600 }, { name: 'weathered', v_top: 1200, v_base: 1800 }] } as never;

describe('model check labels', () => {
  it('says layer fields, nodes, grid and surface as the page labels them', () => {
    expect(fieldLabel('layers[1].v_top', model)).toBe('Layer 2 “weathered”, velocity at top');
    expect(fieldLabel('layers[0].base[1]', model)).toBe('Layer 1 “topsoil”, base node 2');
    expect(fieldLabel('layers[5].v_base', model)).toBe('Layer 6, velocity at base');
    expect(fieldLabel('grid.dx', model)).toBe('Grid, spacing');
    expect(fieldLabel('surface[3]', model)).toBe('Ground surface, node 4');
    expect(fieldLabel('edits[0]', model)).toBe('Painted cell 1');
  });
  it('drops the key the message repeats, and only that', () => {
    expect(plainIssue('layers[1].v_top', 'v_top must be > 0')).toBe('must be > 0');
    expect(plainIssue('layers[0].base[1]', 'z = 500 m is above the grid top')).toBe('z = 500 m is above the grid top');
  });
});
