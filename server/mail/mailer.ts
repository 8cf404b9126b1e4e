import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../env";
import { logger } from "../logger";
import { startFakeSmtpServer, type FakeSmtpServer } from "./fake-smtp-server";

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

type MailDelivery = { transporter: Transporter | null; fakeServer: FakeSmtpServer | null };

let delivery: Promise<MailDelivery> | undefined;

/** True when mail goes to the app's own local fake mail server: no SMTP_URL, and not a production server (or FAKE_SMTP=1). */
export function usesFakeMailServer() {
  return env.fakeMail;
}

/**
 * Starts mail delivery once per process: nodemailer over SMTP to SMTP_URL, or, without it, to a local fake mail
 * server this process starts on 127.0.0.1 (FAKE_SMTP_PORT, or a free port) so development and tests need no set-up.
 */
export function startMailDelivery(): Promise<MailDelivery> {
  delivery ??= (async () => {
    if (env.SMTP_URL) return { transporter: nodemailer.createTransport(env.SMTP_URL), fakeServer: null };
    // A production server never starts the fake mail server on its own: without SMTP_URL it sends no mail at all.
    if (!env.fakeMail) return { transporter: null, fakeServer: null };
    const fakeServer = await startFakeSmtpServer(env.FAKE_SMTP_PORT);
    logger.info({ port: fakeServer.port }, "local fake mail server listening");
    // A real SMTP exchange over TCP, even in tests: plain text on loopback, nothing leaves the machine.
    const transporter = nodemailer.createTransport({ host: fakeServer.host, port: fakeServer.port, secure: false, ignoreTLS: true });
    return { transporter, fakeServer };
  })().catch((error: unknown) => {
    delivery = undefined;
    throw error;
  });
  return delivery;
}

/** The local fake mail server, or null when real mail is configured. */
export async function fakeMailServer(): Promise<FakeSmtpServer | null> {
  if (!usesFakeMailServer()) return null;
  return (await startMailDelivery()).fakeServer;
}

/** Sends one message; rejects when the SMTP server refuses it or cannot be reached. */
export async function sendMail(mail: OutgoingMail) {
  const { transporter } = await startMailDelivery();
  if (!transporter) throw new Error("No mail server is configured: set SMTP_URL (see docs/operations.md).");
  await transporter.sendMail({ from: env.MAIL_FROM, ...mail });
}

/** Closes the transport and the fake mail server, if this process started one. */
export async function stopMailDelivery() {
  if (!delivery) return;
  const current = await delivery.catch(() => null);
  delivery = undefined;
  current?.transporter?.close();
  await current?.fakeServer?.close();
}
