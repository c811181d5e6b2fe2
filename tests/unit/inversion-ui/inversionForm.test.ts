import { describe, expect, it } from 'vitest';
import { DEFAULT_INVERSION_SETTINGS, MAX_INVERSION_ITERATIONS } from '../../../shared/schemas/inversions';
import { checkForm, fieldOfPath, initialFormState, serverFieldErrors, type InversionFormState } from '../../../src/components/inversion/inversionForm';

// What the form must do comes from the issue and API.md: the same zod schema as the server
// (shared/schemas/inversions.ts), defaults filled in, reversed bounds refused, and the server's
// 422 issues shown on the inputs they name by JSON path.

const PICKS = '3f2b8c1e-4d5a-4b6c-8d7e-9f0a1b2c3d4e';
const MODEL = '6a1d2e3f-7b8c-4d9e-a0f1-b2c3d4e5f607';
const form = (changes: Partial<InversionFormState> = {}): InversionFormState => ({ ...initialFormState(PICKS, MODEL), ...changes });

describe('checkForm', () => {
  it('sends the defaults untouched: automatic start, latest revision, default spacing', () => {
    const result = checkForm(form());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.body).toEqual({ pickSetId: PICKS, start: { kind: 'gradient' }, label: '', settings: DEFAULT_INVERSION_SETTINGS });
  });

  it('accepts revision 0, the pick file as uploaded (revisions are numbered from 0)', () => {
    const result = checkForm(form({ revision: '0' }));
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.body.pickSetRevision).toBe(0);
  });

  it('refuses reversed velocity bounds on the upper bound, with both numbers in words', () => {
    const result = checkForm(form({ vMin: '3000', vMax: '2000' }));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors['settings.vMax']).toMatch(/greater than vMin \(3000 m\/s\)/);
  });

  it('names text that is not a number, and reads a decimal comma', () => {
    const bad = checkForm(form({ maxIterations: 'ten' }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors['settings.maxIterations']).toBe('"ten" is not a number');
    const comma = checkForm(form({ verticalWeight: '0,25' }));
    expect(comma.ok && comma.body.settings.verticalWeight).toBe(0.25);
  });

  it('keeps the iteration cap within 1 … the schema maximum', () => {
    for (const [text, words] of [
      ['0', /at least 1/],
      [String(MAX_INVERSION_ITERATIONS + 1), new RegExp(`at most ${MAX_INVERSION_ITERATIONS}`)],
      ['2.5', /whole number/],
    ] as const) {
      const result = checkForm(form({ maxIterations: text }));
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.errors['settings.maxIterations']).toMatch(words);
    }
  });

  it('asks for a number when smoothing or the checker size is set to fixed and left empty', () => {
    const smoothing = checkForm(form({ smoothingMode: 'fixed', smoothing: '' }));
    expect(!smoothing.ok && smoothing.errors['settings.smoothing']).toBe('enter a number');
    const checker = checkForm(form({ checkerboard: true, checkerSizeMode: 'fixed', checkerSize: '' }));
    expect(!checker.ok && checker.errors['settings.checkerSize']).toBe('enter a number');
    const fixed = checkForm(form({ smoothingMode: 'fixed', smoothing: '20', checkerboard: true, checkerSizeMode: 'fixed', checkerSize: '8' }));
    expect(fixed.ok && [fixed.body.settings.smoothing, fixed.body.settings.checkerboard, fixed.body.settings.checkerSize]).toEqual([20, true, 8]);
  });

  it('sends a chosen spacing, and a model start with its version id', () => {
    const spaced = checkForm(form({ spacing: '0.5' }));
    expect(spaced.ok && spaced.body.start).toEqual({ kind: 'gradient', spacing: 0.5 });
    const model = checkForm(form({ startKind: 'model' }));
    expect(model.ok && model.body.start).toEqual({ kind: 'model', modelId: MODEL });
    const noModel = checkForm(form({ startKind: 'model', modelId: '' }));
    expect(!noModel.ok && noModel.errors['start.modelId']).toBeTruthy();
  });
});

describe('server issues on the form', () => {
  it('puts each issue on the input its JSON path names, whichever way the path is written', () => {
    const { fields, other } = serverFieldErrors([
      { path: 'settings.damping', message: 'must be at most 100' },
      { path: ['start', 'modelId'], message: 'that model version belongs to another line' },
      { path: 'start', message: 'choose a start' },
      { path: 'pickSetId', message: 'all picks of this pick set come from one shot' },
      { path: '', message: 'too few picks for the grid' },
      { path: 'grid.nx', message: 'the grid is past the limit' },
    ]);
    expect(fields['settings.damping']).toBe('must be at most 100');
    expect(fields['start.modelId']).toBe('that model version belongs to another line; choose a start');
    expect(fields.pickSetId).toMatch(/one shot/);
    expect(other).toEqual(['too few picks for the grid', 'grid.nx: the grid is past the limit']);
  });

  it('lists pick-file problems with their line in the file, not on an input', () => {
    const { fields, other } = serverFieldErrors([{ path: '', line: 14, column: 'receiver_x', message: 'the geophone lies outside the grid' }]);
    expect(fields).toEqual({});
    expect(other).toEqual(['Pick file line 14, receiver_x: the geophone lies outside the grid']);
  });

  it('maps deeper paths to their input', () => {
    expect(fieldOfPath(['settings', 'vMax'])).toBe('settings.vMax');
    expect(fieldOfPath(['start', 'spacing'])).toBe('start.spacing');
    expect(fieldOfPath(['settings'])).toBeNull();
  });
});
