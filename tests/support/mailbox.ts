// Reads the maildev inbox through its REST API, the way a person would open their mail.
export interface ReceivedMail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
}

const base = () => process.env.MAILDEV_URL!;

export async function mailsTo(address: string): Promise<ReceivedMail[]> {
  const response = await fetch(`${base()}/api/email?to.address=${encodeURIComponent(address)}`);
  if (!response.ok) throw new Error(`maildev answered ${response.status}`);
  return (await response.json()) as ReceivedMail[];
}

/** Waits until a mail to `address` (optionally with a subject containing `subject`) arrives. */
export async function waitForMail(address: string, subject?: string, timeoutMs = 5_000): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mail = (await mailsTo(address)).find((m) => !subject || m.subject.includes(subject));
    if (mail) return mail;
    if (Date.now() > deadline) throw new Error(`No mail to ${address}${subject ? ` about "${subject}"` : ""} arrived`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function linkIn(mail: ReceivedMail, pathPrefix: string): string {
  const match = mail.text.match(new RegExp(`https?://[^\\s]+${pathPrefix}[^\\s]+`));
  if (!match) throw new Error(`No ${pathPrefix} link in the mail "${mail.subject}"`);
  return match[0];
}
