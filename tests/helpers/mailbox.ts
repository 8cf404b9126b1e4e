import { vi } from "vitest";
import type { ReceivedMail } from "@shared/schemas/dev-mail";
import { fakeMailServer } from "../../server/mail/mailer";

/**
 * The newest message the local fake mail server (started by the app under test, in this process) received for
 * `to` whose subject matches; waits briefly, since the SMTP exchange may still be finishing.
 */
export async function waitForMail(to: string, subject: RegExp = /./, timeoutMs = 5_000): Promise<ReceivedMail> {
  const server = await fakeMailServer();
  if (!server) throw new Error("SMTP_URL is set, so there is no local fake mail server to read");
  return vi.waitFor(
    () => {
      const found = server.messages().find((message) => message.to.includes(to.toLowerCase()) && subject.test(message.subject));
      if (!found) throw new Error(`no e-mail to ${to} matching ${subject} arrived within ${timeoutMs} ms`);
      return found;
    },
    { timeout: timeoutMs, interval: 50 },
  );
}

/** Every message received for `to`, newest first. */
export async function mailFor(to: string): Promise<ReceivedMail[]> {
  const server = await fakeMailServer();
  return (server?.messages() ?? []).filter((message) => message.to.includes(to.toLowerCase()));
}

/** The one link in a message that starts with `path` (e.g. "/join"), as a URL. */
export function linkIn(message: ReceivedMail, path: string): URL {
  const links = message.links.map((link) => new URL(link)).filter((url) => url.pathname === path);
  if (links.length === 0) throw new Error(`no ${path} link in "${message.subject}": ${message.links.join(", ")}`);
  return links[0];
}
