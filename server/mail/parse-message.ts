import { simpleParser } from "mailparser";

/** What the fake mail server keeps of a message: enough to read it on the dev mail page and follow its links. */
export type ParsedMessage = { from: string; subject: string; text: string; html: string; links: string[] };

/** Every http(s) link in the message: HTML hrefs first, then addresses written in the text, each once. */
function linksIn(text: string, html: string) {
  const links = new Set<string>();
  for (const match of html.matchAll(/href\s*=\s*"([^"]+)"/gi)) links.add(match[1].replace(/&amp;/g, "&"));
  for (const match of text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)) links.add(match[0]);
  return [...links].filter((link) => /^https?:\/\//i.test(link));
}

/** Parses a raw RFC 5322 message as received over SMTP, with mailparser (MIME parts, RFC 2047 words, transfer encodings). */
export async function parseMessage(raw: Buffer | string): Promise<ParsedMessage> {
  const mail = await simpleParser(raw, { skipImageLinks: true, skipTextLinks: true, skipHtmlToText: true });
  const text = (mail.text ?? "").replace(/\r\n/g, "\n").replace(/\n$/, "");
  const html = typeof mail.html === "string" ? mail.html.replace(/\r\n/g, "\n") : "";
  const from = (mail.from?.value ?? [])
    .map((address) => (address.name ? `${address.name} <${address.address}>` : (address.address ?? "")))
    .join(", ");
  return { from, subject: mail.subject ?? "", text, html, links: linksIn(text, html) };
}
