import helmet from 'helmet';

/**
 * helmet with a Content-Security-Policy the Angular build satisfies: no inline script and no other host, except that
 * live card entry loads Stripe.js, its card frames and its API (the hosts Stripe's integration security guide lists:
 * from memory).
 */
export function securityHeaders(options: { stripeJs: boolean }) {
  const stripe = (...hosts: string[]) => (options.stripeJs ? hosts : []);
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'", ...stripe('https://js.stripe.com')],
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
  });
}
