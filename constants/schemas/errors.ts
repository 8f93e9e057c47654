/** The JSON error body of every failing API call: `{ error: { code, message, fields? } }`. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    /** Field path (dot-joined) → message, for inline form errors. */
    fields?: Record<string, string>;
  };
}
