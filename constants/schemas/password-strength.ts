/**
 * How guessable a password is, estimated with zxcvbn (@zxcvbn-ts/core with its common and English
 * dictionaries: frequent passwords, names, English words, keyboard patterns, dates, repeats,
 * sequences, l33t substitutions). The estimator and its score scale are published in
 * D. L. Wheeler, "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016: score 3
 * means fewer than 10^10 but at least 10^8 guesses, "safely unguessable: moderate protection from
 * an offline slow-hash scenario"; we ask for at least that (our passwords are stored with scrypt).
 *
 * The dictionaries are about 1.6 MB, so the web app loads this module only when a new-password
 * form is checked (see loadPasswordStrength in password-policy.ts); the server imports it directly.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as zxcvbnCommon from '@zxcvbn-ts/language-common';
import * as zxcvbnEn from '@zxcvbn-ts/language-en';
import { PASSWORD_CHECKED_CHARS, PASSWORD_MIN_SCORE, normalisePassword } from './password-policy';

let factory: ZxcvbnFactory | undefined;

function estimator(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({
    dictionary: { ...zxcvbnCommon.dictionary, ...zxcvbnEn.dictionary },
    graphs: zxcvbnCommon.adjacencyGraphs,
    translations: zxcvbnEn.translations,
    // The estimate's cost grows steeply with length and with l33t candidates (seconds for 200
    // characters): the first PASSWORD_CHECKED_CHARS characters and four substitutions keep one
    // check to tens of milliseconds. Judging a prefix can only make the estimate stricter.
    maxLength: PASSWORD_CHECKED_CHARS,
    l33tMaxSubstitutions: 4,
  });
  return factory;
}

/**
 * Why a new password is refused, or null when it passes: too easy to guess (score below
 * PASSWORD_MIN_SCORE), given the person's own e-mail and name as words an attacker would try.
 */
export function passwordStrengthProblem(password: string, userInputs: readonly string[]): string | null {
  const result = estimator().check(normalisePassword(password), [...userInputs]);
  if (result.score >= PASSWORD_MIN_SCORE) return null;
  const why = result.feedback.warning ? ` ${result.feedback.warning}` : '';
  return `Too easy to guess.${why} Add a few unrelated words, or make it longer and less predictable.`;
}
