/**
 * The model file as text (FORMATS.md §1, `*.model.json`): ordinary JSON, laid out so a person can
 * read it: one line per key, per layer, per painted cell, with short arrays kept on one line.
 * Reading it back with JSON.parse gives exactly the same object.
 */
import type { ModelFile } from '../../schemas/model';

const KEY_ORDER = ['format', 'grid', 'surface', 'layers', 'velocity', 'edits'];

export function formatModelFile(model: ModelFile): string {
  const keys = [...KEY_ORDER.filter((k) => k in model && (model as Record<string, unknown>)[k] !== undefined), ...Object.keys(model).filter((k) => !KEY_ORDER.includes(k))];
  const entries = keys
    .filter((k) => (model as Record<string, unknown>)[k] !== undefined)
    .map((k) => {
      const value = (model as Record<string, unknown>)[k];
      const body = Array.isArray(value) && (k === 'layers' || k === 'edits' || k === 'velocity')
        ? listBody(value, k === 'velocity' ? 20 : 1)
        : JSON.stringify(value);
      return `  ${JSON.stringify(k)}: ${body}`;
    });
  return `{\n${entries.join(',\n')}\n}\n`;
}

/** A list with `perLine` items per line (layers and edits one per line, velocities twenty per line). */
function listBody(items: unknown[], perLine: number): string {
  if (items.length === 0) return '[]';
  const lines: string[] = [];
  for (let i = 0; i < items.length; i += perLine) lines.push(`    ${items.slice(i, i + perLine).map((v) => JSON.stringify(v)).join(', ')}`);
  return `[\n${lines.join(',\n')}\n  ]`;
}
