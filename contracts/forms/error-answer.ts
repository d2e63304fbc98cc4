/** The body every API failure answers with: the server's error handler types it with this; the app reads it. */

/** A machine code, a sentence for people and, for bad input, a message per field (4xx). */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}
