import type { TransactionalEmail } from '../mail/outbox';
import { TOPIC_LABELS, type Topic } from './topics';

const PAGE_NAMES: Record<string, string> = {
  home: 'the home page',
  product: 'a product page',
  account: 'the account page',
};

/**
 * The double opt-in message: one single-use link confirms the lists asked for. It is transactional (the person just
 * asked for it) and its reason line says why it came; nothing else goes to the address until the link is opened.
 */
export function confirmSubscriptionMail(
  to: string,
  topics: Topic[],
  productName: string | null,
  page: string,
  link: string,
  teamName: string,
): TransactionalEmail {
  const lists = topics.map(
    (t) => `- ${TOPIC_LABELS[t]}${t === 'drops' && productName ? ` (the next run of ${productName})` : ''}`,
  );
  return {
    to,
    template: 'subscription-confirm',
    reason: { team: teamName },
    subject: `Confirm your ${teamName} e-mails`,
    text: [
      `Someone, hopefully you, asked on ${PAGE_NAMES[page] ?? 'our site'} for e-mails from ${teamName} about:`,
      ...lists,
      '',
      `Confirm with this link (it works once, for 7 days): ${link}`,
    ].join('\n'),
  };
}
