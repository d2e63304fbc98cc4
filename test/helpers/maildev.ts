/** One message as MailDev's REST API returns it. */
export interface CaughtEmail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
}

const base = () => process.env.MAILDEV_URL ?? 'http://127.0.0.1:1080';

/** Messages MailDev has caught for an address. */
export async function emailsTo(address: string): Promise<CaughtEmail[]> {
  const res = await fetch(`${base()}/email`);
  const all = (await res.json()) as CaughtEmail[];
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
}

/** Waits until MailDev holds at least `count` messages for the address matching `subject`. */
export async function waitForEmails(
  address: string,
  subject: RegExp,
  count = 1,
  timeoutMs = 10_000,
): Promise<CaughtEmail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = (await emailsTo(address)).filter((m) => subject.test(m.subject));
    if (found.length >= count || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The first link in a message's text. */
export function firstLink(mail: CaughtEmail): string {
  const m = /https?:\/\/\S+/.exec(mail.text);
  if (!m) throw new Error(`no link in "${mail.subject}"`);
  return m[0];
}
