import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as english from '@zxcvbn-ts/language-en';
import { HttpError } from '../http/errors';

const zxcvbn = new ZxcvbnFactory({
  dictionary: { ...common.dictionary, ...english.dictionary },
  graphs: common.adjacencyGraphs,
  translations: english.translations,
});

/**
 * zxcvbn score 3 = "safely unguessable: moderate protection from an offline slow-hash scenario"
 * (fewer than 10^10 guesses scores 2 or less; zxcvbn README, from memory). Our hashes are scrypt,
 * a slow hash, so 3 is the threshold.
 */
export const MIN_PASSWORD_SCORE = 3;

/** Words an attacker tries first against this product; each person's e-mail and name are added. */
const PRODUCT_WORDS = ['timefield', 'timefield-demo', 'seismic', 'refraction', 'geophysics'];

/** Why a password is too easy to guess, or null when it is strong enough. */
export function passwordWeakness(password: string, person: { email?: string; name?: string }): string | null {
  const inputs = [...PRODUCT_WORDS];
  if (person.email) inputs.push(person.email, ...person.email.split(/[@.+_-]/).filter((w) => w.length > 2));
  if (person.name) inputs.push(person.name, ...person.name.split(/\s+/).filter((w) => w.length > 2));
  const result = zxcvbn.check(password.slice(0, 100), inputs);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const why = [result.feedback.warning, ...result.feedback.suggestions].filter(Boolean).join(' ');
  return `is too easy to guess. ${why || 'Use a longer phrase of unrelated words, not your name or e-mail.'}`;
}

/** 400 with the field's path, in the API's error shape, when the password is weak. */
export function assertStrongPassword(password: string, person: { email?: string; name?: string }, path = 'password'): void {
  const why = passwordWeakness(password, person);
  // The summary stays short; the reason is given once, beside the field.
  if (why) throw new HttpError(400, 'weak_password', 'The password is too easy to guess.', [{ path, message: why }]);
}
