import { z } from 'zod';
import { AppError, FieldErrors } from './app-error';
import { assertStorableText } from './text-guard';

/** Parses a request part against a schema; a mismatch answers 400 with one message per field. */
export function parse<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  // The request guard already checked JSON bodies and query strings; this covers the rest (multipart fields).
  assertStorableText(value);
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const fields: FieldErrors = {};
  for (const issue of result.error.issues) {
    const at = issue.path.join('.');
    // A strict object names each key it does not know, so a misspelt filter shows beside itself.
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys)
        fields[at ? `${at}.${k}` : k] ??= 'Not a field this request takes; check the spelling.';
      continue;
    }
    fields[at || '_'] ??= issue.message;
  }
  throw new AppError(400, 'validation_failed', 'Some fields need attention.', fields);
}

/** The field schemas every form shares live with the contracts, so server and client word errors alike. */
export { fields } from '../../contracts/forms/fields';
