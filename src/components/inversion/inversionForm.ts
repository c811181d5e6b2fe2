import type { ApiIssue } from '../../api/errors';
import { DEFAULT_INVERSION_SETTINGS, startInversionBody, type StartInversionBody } from '../../../shared/schemas/inversions';

/**
 * The start form's state as the user types it (text for numbers), turned into the request body and
 * checked with the same zod schema the server uses, so a mistake is shown before anything is sent.
 * Problems are keyed by the body's JSON path ("settings.vMax"), which is also how the server names
 * them in a 422, so both land on the same input.
 */
export interface InversionFormState {
  pickSetId: string;
  /** '' = the pick set's latest revision. */
  revision: string;
  startKind: 'gradient' | 'model';
  modelId: string;
  /** '' = the default spacing for the line. */
  spacing: string;
  label: string;
  maxIterations: string;
  smoothingMode: 'auto' | 'fixed';
  smoothing: string;
  verticalWeight: string;
  damping: string;
  vMin: string;
  vMax: string;
  order: '1' | '2';
  checkerboard: boolean;
  checkerSizeMode: 'auto' | 'fixed';
  checkerSize: string;
}

/** Every input that can carry a message, by the body path it fills. */
export const FORM_FIELDS = [
  'pickSetId',
  'pickSetRevision',
  'start.modelId',
  'start.spacing',
  'label',
  'settings.maxIterations',
  'settings.smoothing',
  'settings.verticalWeight',
  'settings.damping',
  'settings.vMin',
  'settings.vMax',
  'settings.order',
  'settings.checkerSize',
] as const;
export type FormField = (typeof FORM_FIELDS)[number];
export type FormFieldErrors = Partial<Record<FormField, string>>;

const d = DEFAULT_INVERSION_SETTINGS;

export function initialFormState(pickSetId: string, modelId: string): InversionFormState {
  return {
    pickSetId,
    revision: '',
    startKind: 'gradient',
    modelId,
    spacing: '',
    label: '',
    maxIterations: String(d.maxIterations),
    smoothingMode: d.smoothing === null ? 'auto' : 'fixed',
    smoothing: d.smoothing === null ? '' : String(d.smoothing),
    verticalWeight: String(d.verticalWeight),
    damping: String(d.damping),
    vMin: String(d.vMin),
    vMax: String(d.vMax),
    order: String(d.order) as '1' | '2',
    checkerboard: d.checkerboard,
    checkerSizeMode: d.checkerSize === null ? 'auto' : 'fixed',
    checkerSize: d.checkerSize === null ? '' : String(d.checkerSize),
  };
}

export type FormCheck = { ok: true; body: StartInversionBody } | { ok: false; errors: FormFieldErrors };

/** A number typed in a box: '' → undefined (use the default), "1,5" read as 1.5, anything else unparsable → NaN. */
function readNumber(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t) ? Number(t) : Number.NaN;
}

/** Build the body from the form and check it with the shared schema. */
export function checkForm(state: InversionFormState): FormCheck {
  const errors: FormFieldErrors = {};
  const number = (field: FormField, text: string, required = false): number | undefined => {
    const v = readNumber(text);
    if (v === undefined && required) errors[field] = 'enter a number';
    else if (v !== undefined && Number.isNaN(v)) errors[field] = `"${text.trim()}" is not a number`;
    return v !== undefined && Number.isNaN(v) ? undefined : v;
  };
  const raw = {
    pickSetId: state.pickSetId,
    ...(state.revision === '' ? {} : { pickSetRevision: Number(state.revision) }),
    start: state.startKind === 'model' ? { kind: 'model', modelId: state.modelId } : { kind: 'gradient', ...optional('spacing', number('start.spacing', state.spacing)) },
    label: state.label,
    settings: {
      ...optional('maxIterations', number('settings.maxIterations', state.maxIterations)),
      smoothing: state.smoothingMode === 'auto' ? null : number('settings.smoothing', state.smoothing, true),
      ...optional('verticalWeight', number('settings.verticalWeight', state.verticalWeight)),
      ...optional('damping', number('settings.damping', state.damping)),
      ...optional('vMin', number('settings.vMin', state.vMin)),
      ...optional('vMax', number('settings.vMax', state.vMax)),
      order: Number(state.order),
      checkerboard: state.checkerboard,
      checkerSize: state.checkerboard && state.checkerSizeMode === 'fixed' ? number('settings.checkerSize', state.checkerSize, true) : null,
    },
  };
  const parsed = startInversionBody.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = fieldOfPath(issue.path.map(String));
      // The typed-text messages above say it better than the schema's "expected number".
      if (key && !errors[key]) errors[key] = issue.message;
    }
  }
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  if (!parsed.success) return { ok: false, errors: { pickSetId: 'the form could not be checked' } };
  return { ok: true, body: parsed.data };
}

function optional<K extends string>(key: K, value: number | undefined): Partial<Record<K, number>> {
  return value === undefined ? {} : ({ [key]: value } as Record<K, number>);
}

/** The input a body path belongs to ("settings.vMax" → that box); null when no input on the form matches. */
export function fieldOfPath(path: readonly string[]): FormField | null {
  for (let n = path.length; n > 0; n--) {
    const key = path.slice(0, n).join('.');
    if ((FORM_FIELDS as readonly string[]).includes(key)) return key as FormField;
  }
  // A whole-start problem ("start model from another line") belongs to the model choice.
  if (path[0] === 'start') return 'start.modelId';
  return null;
}

/** An API issue's path as segments, whichever way the server wrote it ("settings.vMax", "layers[1].base", or an array). */
export function issuePathSegments(issue: ApiIssue): string[] {
  if (Array.isArray(issue.path)) return issue.path.map(String);
  return String(issue.path ?? '')
    .split(/[.[\]]+/)
    .filter(Boolean);
}

/** Split a server refusal's issues into messages on the form's inputs and the rest. */
export function serverFieldErrors(issues: readonly ApiIssue[]): { fields: FormFieldErrors; other: string[] } {
  const fields: FormFieldErrors = {};
  const other: string[] = [];
  for (const issue of issues) {
    const segments = issuePathSegments(issue);
    const key = fieldOfPath(segments);
    // A pick-file problem (a shot outside the grid, say) names its line in the file, not an input.
    const place = typeof issue.line === 'number' ? `Pick file line ${issue.line}${issue.column !== undefined && issue.column !== null ? `, ${issue.column}` : ''}` : null;
    if (key && !place) fields[key] = fields[key] ? `${fields[key]}; ${issue.message}` : issue.message;
    else other.push(place ? `${place}: ${issue.message}` : segments.length ? `${segments.join('.')}: ${issue.message}` : issue.message);
  }
  return { fields, other };
}
