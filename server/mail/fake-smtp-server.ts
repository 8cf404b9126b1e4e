import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import type { ReceivedMail } from "@shared/schemas/dev-mail";
import { parseMessage } from "./parse-message";

/** How many messages the fake server keeps; older ones are dropped first. */
export const FAKE_MAILBOX_LIMIT = 200;
const MESSAGE_SIZE_LIMIT = 2 * 1024 * 1024;

export type FakeSmtpServer = {
  host: string;
  port: number;
  /** Received messages, newest first. */
  messages: () => ReceivedMail[];
  close: () => Promise<void>;
};

/**
 * A local SMTP server for development and tests: loopback only, no authentication, no TLS. Every message it
 * accepts is parsed and kept in memory (bounded), so the dev mail page and the tests can read what was sent.
 */
export async function startFakeSmtpServer(port = 0, host = "127.0.0.1"): Promise<FakeSmtpServer> {
  const received: ReceivedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    disableReverseLookup: true,
    banner: "Outroll local fake mail server",
    size: MESSAGE_SIZE_LIMIT,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      stream.on("end", () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error("Message is larger than the fake mail server keeps"), { responseCode: 552 }));
          return;
        }
        const to = session.envelope.rcptTo.map((address) => address.address.toLowerCase());
        parseMessage(Buffer.concat(chunks)).then(
          (parsed) => {
            received.unshift({ id: crypto.randomUUID(), receivedAt: new Date().toISOString(), to, ...parsed });
            if (received.length > FAKE_MAILBOX_LIMIT) received.length = FAKE_MAILBOX_LIMIT;
            callback(null);
          },
          (error: unknown) => callback(error instanceof Error ? error : new Error(String(error))),
        );
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  const address = server.server.address() as AddressInfo;
  return {
    host,
    port: address.port,
    messages: () => [...received],
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
