interface CapturedMail {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: { address: string }[];
  attachments?: { contentType: string; fileName: string }[];
}

/** Polls the mail capture's REST API until a message to `address` arrives (maildev: GET /api/email). */
export async function waitForMail(address: string, { timeoutMs = 15_000, subjectIncludes }: { timeoutMs?: number; subjectIncludes?: string } = {}): Promise<CapturedMail> {
  const base = process.env.TEST_MAILDEV_URL;
  if (!base) throw new Error('TEST_MAILDEV_URL is not set');
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const all = (await (await fetch(`${base}/api/email`)).json()) as CapturedMail[];
    const hit = all.find((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()) && (!subjectIncludes || m.subject.includes(subjectIncludes)));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
}

export function linkToken(mail: CapturedMail): string {
  const m = /token=([A-Za-z0-9_-]{20,})/.exec(mail.text);
  if (!m) throw new Error(`no token link in mail "${mail.subject}"`);
  return m[1]!;
}

/** The bytes of one attachment as captured (maildev 3: GET /api/email/:id/attachment/:filename). */
export async function fetchAttachment(mail: CapturedMail, index = 0): Promise<string> {
  const a = mail.attachments?.[index] as { generatedFileName?: string; fileName?: string } | undefined;
  if (!a) throw new Error(`mail "${mail.subject}" has no attachment ${index}`);
  for (const name of [a.generatedFileName, a.fileName].filter(Boolean) as string[]) {
    const r = await fetch(`${process.env.TEST_MAILDEV_URL}/api/email/${mail.id}/attachment/${encodeURIComponent(name)}`);
    if (r.ok) return r.text();
  }
  throw new Error(`attachment ${index} of "${mail.subject}" could not be fetched`);
}
