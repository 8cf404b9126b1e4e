import type { ReceivedMailList } from "@shared/schemas/dev-mail";
import { HttpError } from "../http-error";
import { fakeMailServer } from "../mail/mailer";

const loopback = new Set(["127.0.0.1", "::1", "::ffff:127.0.0.1"]);

/**
 * What the local fake mail server received, for the development mail page. Only there when no real SMTP_URL is set,
 * and only to requests from this machine, since the messages hold sign-up and password-reset links.
 */
export async function listReceivedMail(clientAddress: string | undefined): Promise<ReceivedMailList> {
  const server = await fakeMailServer();
  if (!server || !clientAddress || !loopback.has(clientAddress)) {
    throw new HttpError(404, "not_found", "There is no development mail page here.");
  }
  return { messages: server.messages() };
}
