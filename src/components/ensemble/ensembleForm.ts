import { DEFAULT_ENSEMBLE_MEMBERS, DEFAULT_ROCK_VELOCITY, startEnsembleBody } from '../../../shared/schemas/ensembles';
import type { StartEnsembleInput } from '../../api/ensembles';

/** The start form as typed: text for the numbers, so a half-typed value is kept as it is. */
export interface EnsembleFormState {
  members: string;
  varyStart: boolean;
  varySmoothing: boolean;
  picks: 'none' | 'sigma' | 'bootstrap';
  rockVelocity: string;
  rockVelocityMax: string;
  seed: string;
  label: string;
}

export const initialEnsembleForm = (): EnsembleFormState => ({
  members: String(DEFAULT_ENSEMBLE_MEMBERS),
  varyStart: true,
  varySmoothing: true,
  picks: 'sigma',
  rockVelocity: String(DEFAULT_ROCK_VELOCITY),
  rockVelocityMax: '',
  seed: '',
  label: '',
});

export type EnsembleFormErrors = Partial<Record<'members' | 'vary' | 'rockVelocity' | 'rockVelocityMax' | 'seed' | 'label', string>>;

const number = (text: string): number | undefined => (text.trim() === '' ? undefined : Number(text.trim()));

/** The request body, checked with the server's own schema; errors keyed by the field they name. */
export function checkEnsembleForm(f: EnsembleFormState): { ok: true; body: StartEnsembleInput } | { ok: false; errors: EnsembleFormErrors } {
  const raw = {
    members: number(f.members),
    vary: { start: f.varyStart, smoothing: f.varySmoothing, picks: f.picks },
    rockVelocity: number(f.rockVelocity),
    ...(f.rockVelocityMax.trim() ? { rockVelocityMax: number(f.rockVelocityMax) } : {}),
    ...(f.seed.trim() ? { seed: number(f.seed) } : {}),
    label: f.label,
  };
  const parsed = startEnsembleBody.safeParse(raw);
  if (parsed.success) return { ok: true, body: parsed.data };
  const errors: EnsembleFormErrors = {};
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? 'vary') as keyof EnsembleFormErrors;
    errors[key] ??= issue.message;
  }
  return { ok: false, errors };
}
