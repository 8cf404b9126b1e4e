import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startFakeSmtpServer, FAKE_MAILBOX_LIMIT, type FakeSmtpServer } from "../../server/mail/fake-smtp-server";
import { parseMessage } from "../../server/mail/parse-message";

describe("reading MIME the way the fake mail server does", () => {
  // The examples of RFC 2047, section 8 ("Examples"): white space between adjacent encoded words is dropped.
  it.each([
    ["=?ISO-8859-1?Q?a?=", "a"],
    ["=?ISO-8859-1?Q?a?= b", "a b"],
    ["=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=", "ab"],
    ["=?ISO-8859-1?Q?a?=  =?ISO-8859-1?Q?b?=", "ab"],
    ["=?ISO-8859-1?Q?a_b?=", "a b"],
    ["=?ISO-8859-1?Q?a?= =?ISO-8859-2?Q?_b?=", "a b"],
    ["=?ISO-8859-1?Q?Keld_J=F8rn_Simonsen?=", "Keld Jørn Simonsen"],
    ["=?US-ASCII?Q?Keith_Moore?=", "Keith Moore"],
  ])("decodes the RFC 2047 example %s", async (encoded, decoded) => {
    expect((await parseMessage(`Subject: ${encoded}\r\n\r\nx\r\n`)).subject).toBe(decoded);
  });

  // RFC 2045, section 6.7: "=" followed by a line break is a soft line break; =XX is one octet.
  it("decodes quoted-printable soft line breaks and octets", async () => {
    const body = (text: string) =>
      parseMessage(`Content-Type: text/plain; charset=utf-8\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n${text}\r\n`);
    expect((await body("Now's the time =\r\nfor all folk to come=\r\n to the aid of their country.")).text).toBe(
      "Now's the time for all folk to come to the aid of their country.",
    );
    expect((await body("caf=C3=A9")).text).toBe("café");
  });

  it("keeps the text and HTML parts of a multipart/alternative message and their links", async () => {
    const raw = [
      "From: Outroll <no-reply@outroll.test>",
      "Subject: =?UTF-8?B?Sm9pbiBNYXRocyDigJMgSGFyYm91cnNpZGU=?=",
      'Content-Type: multipart/alternative; boundary="b1"',
      "",
      "--b1",
      "Content-Type: text/plain; charset=utf-8",
      "Content-Transfer-Encoding: quoted-printable",
      "",
      "Open http://127.0.0.1:3000/join?invitation=3Dabc to join =E2=80=93 once.",
      "--b1",
      "Content-Type: text/html; charset=utf-8",
      "Content-Transfer-Encoding: base64",
      "",
      Buffer.from('<a href="http://127.0.0.1:3000/join?invitation=abc&amp;x=1">Join</a>').toString("base64"),
      "--b1--",
      "",
    ].join("\r\n");
    const parsed = await parseMessage(raw);
    expect(parsed.subject).toBe("Join Maths – Harbourside");
    expect(parsed.text).toBe("Open http://127.0.0.1:3000/join?invitation=abc to join – once.");
    expect(parsed.html).toContain(">Join</a>");
    expect(parsed.links).toEqual(["http://127.0.0.1:3000/join?invitation=abc&x=1", "http://127.0.0.1:3000/join?invitation=abc"]);
  });
});

describe("the local fake SMTP server", () => {
  let server: FakeSmtpServer;
  beforeAll(async () => {
    server = await startFakeSmtpServer(0);
  });
  afterAll(() => server.close());

  it("listens on a free loopback port of its own", () => {
    expect(server.host).toBe("127.0.0.1");
    expect(server.port).toBeGreaterThan(0);
  });

  it("receives a message nodemailer sends over SMTP and reads back its subject, text, HTML and envelope", async () => {
    const transport = nodemailer.createTransport({ host: server.host, port: server.port, secure: false, ignoreTLS: true });
    const info = await transport.sendMail({
      from: "Outroll <no-reply@outroll.test>",
      to: "Ada.Okafor@harbourside.test",
      subject: "Grüße from the Department shelf – version 2",
      text: `A long line that nodemailer must wrap as quoted-printable: ${"é".repeat(60)} https://example.test/a?b=c`,
      html: `<p>Übung</p><a href="https://example.test/html-link">go</a>`,
    });
    expect(info.accepted).toEqual(["Ada.Okafor@harbourside.test"]);
    const [received] = server.messages();
    expect(received.to).toEqual(["ada.okafor@harbourside.test"]);
    expect(received.from).toBe("Outroll <no-reply@outroll.test>");
    expect(received.subject).toBe("Grüße from the Department shelf – version 2");
    expect(received.text).toContain("é".repeat(60));
    expect(received.html).toContain("<p>Übung</p>");
    expect(received.links).toEqual(["https://example.test/html-link", "https://example.test/a?b=c"]);
    transport.close();
  });

  it(`keeps at most ${FAKE_MAILBOX_LIMIT} messages, dropping the oldest`, async () => {
    const transport = nodemailer.createTransport({ host: server.host, port: server.port, secure: false, ignoreTLS: true, pool: true });
    for (let index = 0; index < FAKE_MAILBOX_LIMIT + 5; index += 1) {
      await transport.sendMail({ from: "a@outroll.test", to: "b@outroll.test", subject: `message ${index}`, text: "x" });
    }
    transport.close();
    const messages = server.messages();
    expect(messages.length).toBe(FAKE_MAILBOX_LIMIT);
    expect(messages[0].subject).toBe(`message ${FAKE_MAILBOX_LIMIT + 4}`);
    expect(messages.at(-1)!.subject).toBe("message 5");
  });
});
