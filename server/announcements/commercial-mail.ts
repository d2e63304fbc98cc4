import { escapeHtml } from '../markdown/escape-html';
import { renderMarkdown } from '../markdown/render-markdown';
import type { CommercialEmail } from '../mail/outbox';
import { TOPIC_LABELS, type MailList } from './topics';

/** Who the mail comes from, as the footer names them. */
export interface SenderIdentity {
  teamName: string;
  mailingAddress: string;
  contactEmail: string;
}

/** One commercial message's content, the same for every recipient. */
export interface CommercialContent {
  topic: MailList;
  subject: string;
  markdown: string;
  template: string;
  announcementId?: number;
}

/** One recipient: the address, why they get this list, and their unsubscribe links. */
export interface CommercialRecipient {
  email: string;
  why: string;
  oneClickUrl: string;
  pageUrl: string;
}

/** The footer lines every commercial message ends with: why, who sent it and where, and how to stop it. */
export function commercialFooter(topic: MailList, r: CommercialRecipient, sender: SenderIdentity): string[] {
  return [
    `You get this because ${r.why}.`,
    `Sent by ${sender.teamName}, ${sender.mailingAddress}. Contact: ${sender.contactEmail}.`,
    `Stop e-mails about ${TOPIC_LABELS[topic]} with one click (no sign-in needed): ${r.pageUrl}`,
  ];
}

/**
 * A commercial message for one recipient: the sender identified with a mailing address, an unsubscribe link that
 * works without signing in, and the one-click headers of RFC 8058. The worker checks the suppression list again just
 * before it sends, under the mail's list.
 */
export function commercialMail(
  content: CommercialContent,
  r: CommercialRecipient,
  sender: SenderIdentity,
  dedupeKey?: string,
): CommercialEmail {
  const footer = commercialFooter(content.topic, r, sender);
  return {
    to: r.email,
    subject: content.subject,
    text: `${content.markdown.trim()}\n\n--\n${footer.join('\n')}\n`,
    html: `${renderMarkdown(content.markdown)}\n<hr>\n${footer.map((l) => `<p style="font-size:12px;color:#555">${linkify(l)}</p>`).join('\n')}`,
    template: content.template,
    dedupeKey,
    category: 'commercial',
    list: content.topic,
    announcementId: content.announcementId,
    headers: { 'List-Unsubscribe': `<${r.oneClickUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
  };
}

const linkify = (line: string) => escapeHtml(line).replace(/https?:\/\/\S+/g, (url) => `<a href="${url}">${url}</a>`);
