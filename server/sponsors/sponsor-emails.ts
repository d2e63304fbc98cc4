import type { TransactionalEmail } from '../mail/outbox';

/** Tells a sponsor contact that a published build log credits their organisation. */
export function creditPublishedEmail(
  to: string,
  contactName: string,
  sponsorName: string,
  postTitle: string,
  link: string,
  portalLink: string,
  teamName: string,
): TransactionalEmail {
  return {
    to,
    template: 'sponsor-credit-published',
    reason: { sponsor: sponsorName, team: teamName },
    subject: `${sponsorName} is credited in a new ${teamName} build log`,
    text:
      `Hi ${contactName},\n\nThank you for backing ${teamName}. Our new build log "${postTitle}" credits ${sponsorName}:\n\n${link}\n\n` +
      `Every credit we have delivered under your agreement is listed in the sponsor portal, with a report you can download:\n\n${portalLink}\n\n— ${teamName}`,
  };
}
