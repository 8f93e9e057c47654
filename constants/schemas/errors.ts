/** The JSON error body of every failing API call: `{ error: { code, message, fields? } }`. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    /** Field path (dot-joined) → message, for inline form errors. */
    fields?: Record<string, string>;
  };
}

/**
 * The code of a 401 that answers a password typed into a form (signing a version asks for it
 * again): the session is fine, so the app shows the message on the field instead of asking the
 * person to sign in again.
 */
export const WRONG_PASSWORD_CODE = 'wrong_password';
