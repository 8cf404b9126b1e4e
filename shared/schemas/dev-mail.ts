import { z } from "zod";

/** One message the local fake mail server received, parsed just enough to read it and follow its links. */
export const receivedMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  links: z.array(z.string()),
});
export type ReceivedMail = z.infer<typeof receivedMailSchema>;

/** What GET /api/dev/mail answers: newest first, at most the server's bound. */
export type ReceivedMailList = { messages: ReceivedMail[] };
