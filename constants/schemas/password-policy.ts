/**
 * The password policy, shared by the forms and the server: at least PASSWORD_MIN characters, at
 * most PASSWORD_MAX, and not easy to guess (password-strength.ts, zxcvbn score ≥ 3 with the
 * person's e-mail and name counted as known words). Passwords are compared in Unicode NFKC
 * (Unicode Standard Annex #15), so the same password typed on another keyboard or input method
 * (full-width digits, a ligature) is the same password; NIST SP 800-63B §5.1.1.2 asks for
 * normalisation before hashing, and the server normalises before hashing and before verifying.
 */
import { z } from 'zod';
import { PASSWORD_MAX, PASSWORD_MIN } from './limits';

/** zxcvbn score a new password must reach (0–4; see password-strength.ts). */
export const PASSWORD_MIN_SCORE = 3;
/** How many characters of a password the estimate reads (the rest can only add strength). */
export const PASSWORD_CHECKED_CHARS = 48;
/** A word every Fieldfile password is checked against, as if the person had used it themselves. */
const PRODUCT_WORDS = ['fieldfile'];

/** What the new-password fields say under themselves. */
export const NEW_PASSWORD_HINT = `At least ${PASSWORD_MIN} characters, and not easy to guess. A few unrelated words make a strong one.`;

export const normalisePassword = (password: string): string => password.normalize('NFKC');

/**
 * The person's own words an attacker would try first: the e-mail, its parts, the name's words,
 * and the name run together either way round ("miraokafor", "okaformira").
 */
export function passwordUserInputs(person: { email?: string; name?: string | readonly string[] }): string[] {
  const words = new Set(PRODUCT_WORDS);
  const add = (w: string) => {
    if (w.length >= 3) words.add(w);
  };
  const email = person.email?.trim().toLowerCase();
  if (email) {
    add(email);
    const [local = '', domain = ''] = email.split('@');
    const localParts = local.split(/[._+-]+/);
    [local, localParts.join(''), ...localParts, ...domain.split('.')].forEach(add);
  }
  // A person may go by several names (one per organisation).
  const names = typeof person.name === 'string' ? [person.name] : (person.name ?? []);
  for (const name of names) {
    const parts = name.toLowerCase().split(/\s+/).filter(Boolean);
    parts.forEach(add);
    if (parts.length > 1) {
      add(parts.join(''));
      add([...parts].reverse().join(''));
    }
  }
  return [...words];
}

/**
 * The length rules on the NFKC form. Used by the server's routes, which check guessability in
 * the service (after the link or the current password proved who is asking, since the estimate
 * costs tens of milliseconds).
 */
export const zNewPassword = z
  .string({ error: 'Choose a password.' })
  .max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`)
  .transform(normalisePassword)
  .pipe(z.string().min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`));

/** The estimator with its dictionaries, loaded on first use (a separate chunk in the web app). */
export const loadPasswordStrength = () => import('./password-strength');

/**
 * For the forms: zNewPassword plus the guessability check for this person, so the message shows
 * on the field before anything is sent (the server checks the same again). Parse it with
 * parseAsync (react-hook-form's zodResolver does).
 */
export function zNewPasswordFor(person: { email?: string; name?: string | readonly string[] }) {
  const inputs = passwordUserInputs(person);
  return zNewPassword.superRefine(async (password, ctx) => {
    if (password.length < PASSWORD_MIN) return; // the length message says enough
    const { passwordStrengthProblem } = await loadPasswordStrength();
    const problem = passwordStrengthProblem(password, inputs);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}
