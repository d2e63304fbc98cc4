import { z } from 'zod';

/**
 * The one rule for a card token sent by the browser, for dues and the shop alike: the processor's single-use tokens
 * (and its published test tokens) are short runs of letters, digits, `_`, `|` and `-`; anything else never reaches
 * the processor.
 */
export const cardToken = z
  .string({ error: 'Choose a card.' })
  .trim()
  .min(3, 'Choose a card.')
  .max(200, 'Not a card token.')
  .regex(/^[A-Za-z0-9_|-]+$/, 'Not a card token.');
