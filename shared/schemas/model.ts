/**
 * zod 4 schema for the velocity model file "timefield-model/1" (FORMATS.md §1).
 * The API validates request bodies with `modelFileSchema`; the same schema, plus the
 * rule checks in shared/model/rules.ts, is what parseModelFile runs.
 *
 * Structural checks (types, signs, sizes) live here; geometric rules (x increasing,
 * coverage, grid size, velocity count) run afterwards as one superRefine, so a file with
 * a structural error gets those errors first. Unknown keys are kept (FORMATS.md lets tools add
 * extras, and an editor's extras survive a round trip), but an object whose unknown keys hold more
 * than MAX_EXTRA_CHARS of JSON is refused with the key's path, so junk is never stored.
 * Every number is checked against its plausible range (shared/limits.ts).
 */
import { z } from 'zod';
import { MAX_GRID_NODES, SPACING_RANGE, VELOCITY_RANGE, X_RANGE, Z_RANGE, outOfRange } from '../limits';
import { checkModelRules } from '../model/rules';
import { inRange } from './ranges';

/** Missing keys say "is required"; present but wrong values say what was expected. */
const expect = (what: string, text: string) => (issue: { input?: unknown }) =>
  issue.input === undefined ? `${what} is required` : `${what} ${text}`;
const finite = (what: string) => z.number({ error: expect(what, 'must be a finite number') });
const positive = (what: string) => finite(what).positive({ error: `${what} must be > 0` });
const count = (what: string) =>
  z.number({ error: expect(what, 'must be a whole number') }).int({ error: `${what} must be a whole number` });

const velocity = (what: string) => inRange(positive(what), VELOCITY_RANGE, what);
const spacing = (what: string) => inRange(positive(what), SPACING_RANGE, what);

export const gridSchema = z.looseObject({
  x0: inRange(finite('x0'), X_RANGE, 'x0'),
  dx: spacing('dx'),
  nx: count('nx').min(2, { error: 'nx must be at least 2' }),
  z0: inRange(finite('z0'), Z_RANGE, 'z0'),
  dz: spacing('dz'),
  nz: count('nz').min(2, { error: 'nz must be at least 2' }),
}, { error: expect('grid', 'must be an object {x0, dx, nx, z0, dz, nz}') });

/** A polyline vertex [x, z] in metres (x along the line, z elevation). */
export const pointSchema = z.tuple([inRange(finite('x'), X_RANGE, 'x'), inRange(finite('z'), Z_RANGE, 'z')], { error: 'must be a point [x, z]' });
export const polylineSchema = z
  .array(pointSchema, { error: 'must be a list of points [[x, z], ...]' })
  .min(2, { error: 'needs at least two points' });

export const layerSchema = z.looseObject({
  name: z.string({ error: 'name must be text' }).optional(),
  base: polylineSchema.optional(),
  v_top: velocity('v_top'),
  v_base: velocity('v_base'),
});

/**
 * A painted cell over the rasterised result (our extension, FORMATS.md allows extra keys):
 * node (ix, iz) gets velocity v (m/s). Later edits of the same node win. Edits on air
 * nodes do not turn them into ground.
 */
export const editSchema = z.looseObject({
  ix: count('ix').min(0, { error: 'ix must be ≥ 0' }),
  iz: count('iz').min(0, { error: 'iz must be ≥ 0' }),
  v: velocity('v'),
});

/** Up to this many per-value errors are reported for a raw velocity grid. */
const MAX_VELOCITY_ISSUES = 20;

/**
 * Raw velocity grid, checked with a plain loop: z.array(z.number()) would build one
 * issue object per bad value, which for a two-million-node grid of garbage is too many.
 */
export const velocityGridSchema = z
  .custom<number[]>((v) => Array.isArray(v), { error: 'velocity must be a list of numbers' })
  .superRefine((values, ctx) => {
    let reported = 0;
    for (let i = 0; i < values.length && reported < MAX_VELOCITY_ISSUES; i++) {
      const v = values[i];
      if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) {
        reported++;
        ctx.addIssue({ code: 'custom', path: [i], message: `${JSON.stringify(v)} is not a velocity > 0 (m/s)` });
      } else if (outOfRange(v, VELOCITY_RANGE)) {
        reported++;
        ctx.addIssue({ code: 'custom', path: [i], message: `velocity ${outOfRange(v, VELOCITY_RANGE)}` });
      }
    }
  });

/** Optional per-node or per-column numbers written by the inversion tool (FORMATS.md §3: coverage, doi); null where undefined. */
const numberListSchema = (what: string) =>
  z
    .array(z.number({ error: `${what} values must be finite numbers or null` }).nullable(), { error: `${what} must be a list of numbers` })
    .max(MAX_GRID_NODES, { error: `${what} has more values than the largest grid` });

export const MODEL_FORMAT = 'timefield-model/1';

export const modelFileSchema = z
  .looseObject({
    format: z.literal(MODEL_FORMAT, { error: `format must be "${MODEL_FORMAT}"` }),
    description: z.string({ error: 'description must be text' }).max(2000, { error: 'description must be at most 2 000 characters' }).optional(),
    grid: gridSchema,
    surface: polylineSchema.optional(),
    velocity: velocityGridSchema.optional(),
    layers: z.array(layerSchema, { error: 'layers must be a list' }).min(1, { error: 'needs at least one layer' }).optional(),
    edits: z.array(editSchema, { error: 'edits must be a list' }).max(MAX_GRID_NODES, { error: 'more edits than grid nodes' }).optional(),
    coverage: numberListSchema('coverage').optional(),
    doi: numberListSchema('doi').optional(),
  }, { error: 'a model file must be a JSON object' })
  .superRefine((model, ctx) => {
    for (const issue of oversizedExtras(model)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
    for (const issue of checkModelRules(model)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  });

export type ModelFile = z.infer<typeof modelFileSchema>;
export type ModelGrid = z.infer<typeof gridSchema>;
export type ModelLayer = z.infer<typeof layerSchema>;
export type ModelEdit = z.infer<typeof editSchema>;
export type PolylinePoints = z.infer<typeof polylineSchema>;

/** JSON characters that the unknown keys of one object may hold (a note, a colour, an editor's settings). */
export const MAX_EXTRA_CHARS = 64 * 1024;

const KNOWN_KEYS: Record<string, ReadonlySet<string>> = {
  model: new Set(['format', 'description', 'grid', 'surface', 'velocity', 'layers', 'edits', 'coverage', 'doi']),
  grid: new Set(['x0', 'dx', 'nx', 'z0', 'dz', 'nz']),
  layer: new Set(['name', 'base', 'v_top', 'v_base']),
  edit: new Set(['ix', 'iz', 'v']),
};

/** Unknown keys holding more than MAX_EXTRA_CHARS, at the model's top level, in the grid, a layer or an edit. */
function oversizedExtras(model: Record<string, unknown>): { path: (string | number)[]; message: string }[] {
  const found: { path: (string | number)[]; message: string }[] = [];
  const check = (obj: unknown, known: ReadonlySet<string>, at: (string | number)[]) => {
    if (!obj || typeof obj !== 'object') return;
    for (const [key, value] of Object.entries(obj)) {
      if (known.has(key)) continue;
      const size = JSON.stringify(value ?? null).length;
      if (size > MAX_EXTRA_CHARS) found.push({ path: [...at, key], message: `unknown key holding ${Math.round(size / 1024)} kB; not part of the model file format (extras may hold at most ${MAX_EXTRA_CHARS / 1024} kB)` });
    }
  };
  check(model, KNOWN_KEYS.model, []);
  check(model.grid, KNOWN_KEYS.grid, ['grid']);
  (Array.isArray(model.layers) ? model.layers : []).forEach((l, i) => check(l, KNOWN_KEYS.layer, ['layers', i]));
  (Array.isArray(model.edits) ? model.edits : []).forEach((e, i) => check(e, KNOWN_KEYS.edit, ['edits', i]));
  return found;
}
