import type { RequestHandler } from 'express';
import { AppError, notFound, type FieldErrors } from './app-error';

// PostgreSQL refuses U+0000 in text (a 500 if it gets that far), and a lone UTF-16 surrogate has no UTF-8 form, so
// the driver would silently store U+FFFD instead. Both are refused at the edge, once, for every route.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be stored, or null when it can. */
export function badTextReason(s: string): string | null {
  if (s.includes('\u0000')) return 'Remove the NUL character (U+0000); it cannot be stored.';
  if (LONE_SURROGATE.test(s)) return 'Contains a broken character (a lone UTF-16 surrogate); retype it.';
  return null;
}

/** Every string (and object key) in a parsed value that cannot be stored, as field path -> message. */
export function badTextFields(value: unknown, at = '', found: FieldErrors = {}, depth = 0): FieldErrors {
  // JSON bodies are at most 100 kB, but a deep array would still walk the stack; deeper than this is refused anyway.
  if (depth > 64) return found;
  if (typeof value === 'string') {
    const reason = badTextReason(value);
    if (reason) found[at || '_'] ??= reason;
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => badTextFields(v, at ? `${at}.${i}` : String(i), found, depth + 1));
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const keyReason = badTextReason(k);
      // eslint-disable-next-line no-control-regex -- the NUL character is what this guard reports, so it must match it
      const name = keyReason ? k.replace(/\u0000/g, '\\0').replace(/[\uD800-\uDFFF]/g, '\uFFFD') : k;
      const path = at ? `${at}.${name}` : name;
      if (keyReason) found[path] ??= `The field name: ${keyReason}`;
      else badTextFields(v, path, found, depth + 1);
    }
  }
  return found;
}

/** Throws the usual 400 when `value` holds text that cannot be stored (used by parse() and the request guard). */
export function assertStorableText(value: unknown): void {
  const fields = badTextFields(value);
  if (Object.keys(fields).length)
    throw new AppError(400, 'validation_failed', 'Some fields hold characters that cannot be stored.', fields);
}

/**
 * The request guard for every /api route: NUL in a path segment answers 404 (no record can have that name), NUL or
 * a lone surrogate in the query string or the JSON body answers 400 naming the field.
 */
export const refuseUnstorableText: RequestHandler = function refuseUnstorableText(req, _res, next) {
  let path: string;
  try {
    path = decodeURIComponent(req.path);
  } catch {
    // Malformed percent-encoding (or encoded bytes that are not UTF-8): no route can match it.
    return next(notFound());
  }
  if (badTextReason(path)) return next(notFound());
  try {
    assertStorableText(req.query);
    assertStorableText(req.body);
  } catch (err) {
    return next(err);
  }
  next();
};
