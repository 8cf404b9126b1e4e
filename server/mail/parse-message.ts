/** What the fake mail server keeps of a message: enough to read it on the dev mail page and follow its links. */
export type ParsedMessage = { from: string; subject: string; text: string; html: string; links: string[] };

type MimePart = { headers: Map<string, string>; body: string };

// Raw message text is held as "binary" (latin1) strings so every byte maps to one character until a charset is known.
function bytesOf(binary: string) {
  return Buffer.from(binary, "latin1");
}

function decodeCharset(bytes: Buffer, charset: string) {
  try {
    return new TextDecoder(charset.trim().toLowerCase() || "utf-8").decode(bytes);
  } catch {
    return new TextDecoder("utf-8").decode(bytes);
  }
}

function splitHeadersFromBody(raw: string): [string, string] {
  const match = /\r?\n\r?\n/.exec(raw);
  if (!match) return [raw, ""];
  return [raw.slice(0, match.index), raw.slice(match.index + match[0].length)];
}

/** Header lines unfolded (RFC 5322 section 2.2.3); the first occurrence of a name wins. */
function parseHeaderBlock(block: string) {
  const headers = new Map<string, string>();
  const unfolded = block.replace(/\r?\n[ \t]+/g, " ");
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(":");
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return headers;
}

/** A structured header such as `text/plain; charset=utf-8` split into its value and parameters. */
function headerWithParameters(value = "") {
  const [main, ...rest] = value.split(";");
  const parameters = new Map<string, string>();
  for (const piece of rest) {
    const equals = piece.indexOf("=");
    if (equals <= 0) continue;
    const key = piece.slice(0, equals).trim().toLowerCase();
    const raw = piece.slice(equals + 1).trim();
    parameters.set(key, raw.startsWith('"') && raw.endsWith('"') ? raw.slice(1, -1) : raw);
  }
  return { value: main.trim().toLowerCase(), parameters };
}

/** Quoted-printable bytes (RFC 2045 section 6.7): soft line breaks removed, =XX turned back into bytes. */
export function decodeQuotedPrintable(binary: string): Buffer {
  const joined = binary.replace(/=\r?\n/g, "");
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i += 1) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(joined.charCodeAt(i) & 0xff);
    }
  }
  return Buffer.from(bytes);
}

/** Encoded words in a header (RFC 2047), with the white space between two adjacent encoded words dropped. */
export function decodeEncodedWords(value: string): string {
  const word = /=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g;
  const joined = value.replace(/(=\?[^?]+\?[BbQq]\?[^?]*\?=)\s+(?==\?[^?]+\?[BbQq]\?[^?]*\?=)/g, "$1");
  return joined.replace(word, (_all, charset: string, encoding: string, text: string) => {
    const bytes =
      encoding.toUpperCase() === "B" ? Buffer.from(text, "base64") : decodeQuotedPrintable(text.replace(/_/g, " "));
    return decodeCharset(bytes, charset.split("*")[0]);
  });
}

function decodeBody(part: MimePart) {
  const type = headerWithParameters(part.headers.get("content-type") ?? "text/plain");
  const encoding = (part.headers.get("content-transfer-encoding") ?? "7bit").trim().toLowerCase();
  const bytes =
    encoding === "base64"
      ? Buffer.from(part.body.replace(/\s+/g, ""), "base64")
      : encoding === "quoted-printable"
        ? decodeQuotedPrintable(part.body)
        : bytesOf(part.body);
  return decodeCharset(bytes, type.parameters.get("charset") ?? "utf-8");
}

function parsePart(raw: string): MimePart {
  const [headerBlock, body] = splitHeadersFromBody(raw);
  return { headers: parseHeaderBlock(headerBlock), body };
}

/** Walks the MIME tree and keeps the first text/plain and the first text/html body; attachments are skipped. */
function collectBodies(part: MimePart, found: { text?: string; html?: string }, depth = 0) {
  const type = headerWithParameters(part.headers.get("content-type") ?? "text/plain");
  const disposition = headerWithParameters(part.headers.get("content-disposition")).value;
  if (type.value.startsWith("multipart/")) {
    const boundary = type.parameters.get("boundary");
    if (!boundary || depth > 5) return;
    const delimiter = `--${boundary}`;
    const sections = part.body.split(delimiter).slice(1);
    for (const section of sections) {
      if (section.startsWith("--")) break;
      // The line break before a delimiter belongs to the delimiter (RFC 2046 section 5.1.1).
      collectBodies(parsePart(section.replace(/^[ \t]*\r?\n/, "").replace(/\r?\n$/, "")), found, depth + 1);
    }
    return;
  }
  if (disposition === "attachment") return;
  if (type.value === "text/plain" && found.text === undefined) found.text = decodeBody(part);
  if (type.value === "text/html" && found.html === undefined) found.html = decodeBody(part);
}

/** Every http(s) link in the message, from the HTML's href attributes first, then bare addresses in the text. */
function linksIn(text: string, html: string) {
  const links = new Set<string>();
  for (const match of html.matchAll(/href\s*=\s*"([^"]+)"/gi)) links.add(match[1].replace(/&amp;/g, "&"));
  for (const match of text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)) links.add(match[0]);
  return [...links].filter((link) => /^https?:\/\//i.test(link));
}

/** Parses a raw RFC 5322 message as received over SMTP (bytes given as a latin1 string). */
export function parseMessage(raw: string): ParsedMessage {
  const root = parsePart(raw);
  const header = (name: string) => decodeEncodedWords(decodeCharset(bytesOf(root.headers.get(name) ?? ""), "utf-8"));
  const found: { text?: string; html?: string } = {};
  collectBodies(root, found);
  const text = (found.text ?? "").replace(/\r\n/g, "\n");
  const html = (found.html ?? "").replace(/\r\n/g, "\n");
  return { from: header("from"), subject: header("subject"), text, html, links: linksIn(text, html) };
}
