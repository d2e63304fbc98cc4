/**
 * The words shown beside every sign-up form. A change of wording gets a new version; each consent record keeps the
 * version and the exact text the person saw, which is the proof of what they agreed to.
 */
export const CONSENT_WORDING = {
  version: '2026-12-v1',
  /** The sentence shown and stored with each consent, naming the team the person gives consent to. */
  text: (teamName: string) =>
    `Yes, ${teamName} may e-mail me about the lists I ticked. I will get a message to confirm first, and every e-mail ` +
    'has a link to stop them at once. My address is not shared.',
};
