/**
 * A hand assignment of picks to refractors for `npm run layers --assignment A.csv`:
 *
 *   shot_id,receiver_x,layer
 *   S01,24.0,1
 *
 * `layer` 0 is the direct wave, 1 the first refractor, 2 the second; −1 leaves the pick out.
 * Listed picks take the given layer; the others keep the automatic assignment. Errors name the
 * line and the column, and the whole file is refused.
 */
import type { PlacedShot } from '../../shared/picks';
import type { Assignment } from '../../shared/layers';
import { InputError } from './cli-inputs';

export async function readAssignment(
  path: string,
  shots: readonly PlacedShot[],
  automatic: Assignment,
  layers: number,
  read: (path: string) => Promise<string>,
): Promise<Assignment> {
  let text: string;
  try {
    text = await read(path);
  } catch (err) {
    throw new InputError(`${path}: cannot read the assignment file (${(err as NodeJS.ErrnoException).code ?? (err as Error).message})`);
  }
  const assignment = automatic.map((a) => Int8Array.from(a));
  const errors: string[] = [];
  const lines = text.split(/\r?\n/);
  const header = lines[0]?.split(',').map((h) => h.trim().toLowerCase()) ?? [];
  const col = (name: string) => header.indexOf(name);
  const need = ['shot_id', 'receiver_x', 'layer'];
  const missing = need.filter((n) => col(n) < 0);
  if (missing.length) throw new InputError(`${path}: line 1: the header must name the columns ${need.join(', ')} (missing ${missing.join(', ')})`);
  const byId = new Map(shots.map((s, i) => [s.shotId, i]));
  for (let l = 1; l < lines.length && errors.length < 20; l++) {
    const line = lines[l];
    if (!line.trim() || line.trimStart().startsWith('#')) continue;
    const cells = line.split(',').map((c) => c.trim());
    const at = (name: string) => `line ${l + 1}, ${name}`;
    const s = byId.get(cells[col('shot_id')]);
    if (s === undefined) {
      errors.push(`${at('shot_id')}: no shot "${cells[col('shot_id')]}" in the pick file`);
      continue;
    }
    const x = Number(cells[col('receiver_x')]);
    if (cells[col('receiver_x')] === '' || !Number.isFinite(x)) {
      errors.push(`${at('receiver_x')}: "${cells[col('receiver_x')]}" is not a number`);
      continue;
    }
    const layer = Number(cells[col('layer')]);
    if (!Number.isInteger(layer) || layer < -1 || layer >= layers) {
      errors.push(`${at('layer')}: must be a whole number from -1 to ${layers - 1} (got "${cells[col('layer')]}")`);
      continue;
    }
    const shot = shots[s];
    const k = shot.picks.findIndex((_, i) => Math.abs(shot.receivers[2 * i] - x) < 1e-3);
    if (k < 0) {
      errors.push(`${at('receiver_x')}: shot ${shot.shotId} has no pick at ${x} m`);
      continue;
    }
    assignment[s][k] = layer;
  }
  if (errors.length) throw new InputError(`${path}: the assignment file has errors:\n${errors.map((e) => `  ${e}`).join('\n')}`);
  return assignment;
}
