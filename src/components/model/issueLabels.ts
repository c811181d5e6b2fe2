/**
 * A model check's JSON path (`layers[1].v_top`, the file format's own, FORMATS.md §1) said as the
 * editor labels the field ("Layer 2 “weathered”, velocity at top"), and its message without the
 * key it repeats ("v_top must be > 0" → "must be > 0"). The path stays for files and the API.
 */
import type { ModelFile } from '../../../shared/model';

const GRID: Record<string, string> = { x0: 'Grid, x from', dx: 'Grid, spacing', dz: 'Grid, spacing', nx: 'Grid, x to', nz: 'Grid, depth', z0: 'Grid, top elevation' };
const LAYER_FIELD: Record<string, string> = { v_top: 'velocity at top', v_base: 'velocity at base', name: 'name', base: 'base' };

export function fieldLabel(path: string, model: Pick<ModelFile, 'layers'> | null): string {
  const layer = /^layers\[(\d+)\](?:\.(\w+))?(?:\[(\d+)\])?/.exec(path);
  if (layer) {
    const k = Number(layer[1]);
    const name = model?.layers?.[k]?.name;
    const who = `Layer ${k + 1}${name ? ` “${name}”` : ''}`;
    if (!layer[2]) return who;
    const field = LAYER_FIELD[layer[2]] ?? layer[2];
    return layer[3] !== undefined ? `${who}, ${field} node ${Number(layer[3]) + 1}` : `${who}, ${field}`;
  }
  const grid = /^grid\.(\w+)/.exec(path);
  if (grid) return GRID[grid[1]] ?? `Grid, ${grid[1]}`;
  if (path === 'grid') return 'Grid';
  const surface = /^surface(?:\[(\d+)\])?/.exec(path);
  if (surface) return surface[1] !== undefined ? `Ground surface, node ${Number(surface[1]) + 1}` : 'Ground surface';
  const edit = /^edits\[(\d+)\]/.exec(path);
  if (edit) return `Painted cell ${Number(edit[1]) + 1}`;
  if (path === 'velocity' || path.startsWith('velocity[')) return 'Velocity grid';
  return path || 'The model';
}

/** The message without a leading repeat of the field's key ("v_top must be > 0" → "must be > 0"). */
export function plainIssue(path: string, message: string): string {
  const key = /(\w+)(?:\[\d+\])?$/.exec(path)?.[1];
  return key && message.startsWith(`${key} `) ? message.slice(key.length + 1) : message;
}
