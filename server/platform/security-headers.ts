import { randomBytes } from 'node:crypto';
import type { ServerResponse } from 'node:http';
import type { RequestHandler, Response } from 'express';
import helmet from 'helmet';

/**
 * A fresh CSP nonce for every response (128 random bits, base64: the CSP Level 3 advice of at least 128 bits, from
 * memory), in `res.locals.cspNonce`; the server render puts it on the inline scripts it writes.
 */
export const cspNonce: RequestHandler = (_req, res, next) => {
  res.locals.cspNonce = randomBytes(16).toString('base64');
  next();
};

/**
 * helmet with a Content-Security-Policy the Angular build satisfies: no inline script except the server render's own,
 * which carry this response's nonce, and no other host, except that live card entry loads Stripe.js, its card frames
 * and its API (the hosts Stripe's integration security guide lists: from memory). Needs `cspNonce` before it.
 */
export function securityHeaders(options: { stripeJs: boolean }) {
  const stripe = (...hosts: string[]) => (options.stripeJs ? hosts : []);
  const nonce = (_req: unknown, res: ServerResponse) => `'nonce-${(res as Response).locals.cspNonce as string}'`;
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'", ...stripe('https://js.stripe.com'), nonce],
        // Angular writes component styles into <style> elements at run time.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'"],
        connectSrc: ["'self'", ...stripe('https://api.stripe.com')],
        frameSrc: options.stripeJs ? ['https://js.stripe.com', 'https://hooks.stripe.com'] : ["'none'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
    crossOriginEmbedderPolicy: false,
    // Sent by hstsOverHttps only when the request itself came over HTTPS.
    strictTransportSecurity: false,
  });
}

/** Browser features Padside never uses; each is denied to every document (and every frame in it). */
const DENIED_FEATURES = [
  'accelerometer',
  'autoplay',
  'bluetooth',
  'display-capture',
  'encrypted-media',
  'geolocation',
  'gyroscope',
  'hid',
  'magnetometer',
  'microphone',
  'midi',
  'payment',
  'publickey-credentials-get',
  'screen-wake-lock',
  'serial',
  'usb',
  'xr-spatial-tracking',
];

/**
 * The pages that scan member QR codes with the camera (the console check-in and a launch day's range table); only a
 * document loaded at one of these paths may use it.
 */
export const CAMERA_PAGES: readonly RegExp[] = [/^\/console\/check-in$/, /^\/console\/range(\/\d+)?$/];

/** The Permissions-Policy value for a document at `path`. */
export function permissionsPolicyFor(path: string): string {
  const page = path.replace(/\/+$/, '');
  const camera = CAMERA_PAGES.some((p) => p.test(page)) ? 'camera=(self)' : 'camera=()';
  return [camera, ...DENIED_FEATURES.map((f) => `${f}=()`)].join(', ');
}

/** Permissions-Policy on every answer; the policy is fixed per document, so the camera page is loaded in full. */
export const permissionsPolicy: RequestHandler = (req, res, next) => {
  res.setHeader('Permissions-Policy', permissionsPolicyFor(req.path));
  next();
};

/**
 * HSTS only on an answer to an HTTPS request (`req.secure`, which honours X-Forwarded-Proto from the trusted proxy):
 * over plain HTTP the header is ignored by browsers anyway (RFC 6797 section 8.1) and only misleads.
 */
export const hstsOverHttps: RequestHandler = (req, res, next) => {
  if (req.secure) res.setHeader('Strict-Transport-Security', 'max-age=31536000; includeSubDomains');
  next();
};

/** Answers that depend on the session are never stored by a browser or a shared cache (ASVS 4.0.3 8.2.1). */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
