import type { OutgoingMail } from "./mailer";

function escapeHtml(value: string) {
  return value.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "full", timeStyle: "short", timeZone: "UTC" });

function layout(heading: string, paragraphs: string[], action: { label: string; url: string }, after: string[]) {
  const p = (text: string) => `<p style="margin:0 0 16px;font-size:16px;line-height:1.5">${text}</p>`;
  return [
    `<!doctype html><html lang="en"><body style="margin:0;background:#f6efe3;font-family:Verdana,sans-serif;color:#12263a">`,
    `<div style="max-width:560px;margin:0 auto;padding:24px;background:#fffdf9">`,
    `<h1 style="font-size:22px;margin:0 0 16px">${heading}</h1>`,
    ...paragraphs.map(p),
    `<p style="margin:24px 0"><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#0f6b63;color:#ffffff;padding:12px 20px;border-radius:10px;font-weight:bold;text-decoration:none">${escapeHtml(action.label)}</a></p>`,
    p(`Or open this address: ${escapeHtml(action.url)}`),
    ...after.map(p),
    `</div></body></html>`,
  ].join("\n");
}

/** The e-mail that invites a colleague to join a department as a teacher. */
export function invitationMail(input: {
  to: string;
  departmentName: string;
  inviterName: string;
  joinUrl: string;
  expiresAt: Date;
}): OutgoingMail {
  const expires = `${dateFormat.format(input.expiresAt)} UTC`;
  const subject = `${input.inviterName} invites you to join ${input.departmentName} on Outroll`;
  const text = [
    `Hello,`,
    ``,
    `${input.inviterName} invites you to join ${input.departmentName} on Outroll as a teacher.`,
    `Outroll helps maths departments plan and run probability lessons with intransitive dice, and share lesson templates on the Department shelf.`,
    ``,
    `Join the department here (the link works once and expires on ${expires}):`,
    input.joinUrl,
    ``,
    `Sign up with this address, ${input.to}, or sign in if you already have an Outroll account with it.`,
    `If you did not expect this invitation, ignore this e-mail; nothing happens unless the link is used.`,
  ].join("\n");
  const html = layout(
    `Join ${escapeHtml(input.departmentName)} on Outroll`,
    [
      `${escapeHtml(input.inviterName)} invites you to join <strong>${escapeHtml(input.departmentName)}</strong> on Outroll as a teacher.`,
      `Outroll helps maths departments plan and run probability lessons with intransitive dice, and share lesson templates on the Department shelf.`,
    ],
    { label: "Join the department", url: input.joinUrl },
    [
      `The link works once and expires on ${escapeHtml(expires)}. Sign up with this address, ${escapeHtml(input.to)}, or sign in if you already have an Outroll account with it.`,
      `If you did not expect this invitation, ignore this e-mail; nothing happens unless the link is used.`,
    ],
  );
  return { to: input.to, subject, text, html };
}

/** The e-mail with a link to choose a new password. */
export function passwordResetMail(input: { to: string; name: string; resetUrl: string; validMinutes: number }): OutgoingMail {
  const subject = "Choose a new Outroll password";
  const text = [
    `Hello ${input.name},`,
    ``,
    `Someone asked to reset the password of the Outroll account for ${input.to}.`,
    `Choose a new password here (the link works once, for ${input.validMinutes} minutes):`,
    input.resetUrl,
    ``,
    `If it was not you, ignore this e-mail: your password stays as it is.`,
  ].join("\n");
  const html = layout(
    "Choose a new password",
    [`Hello ${escapeHtml(input.name)},`, `Someone asked to reset the password of the Outroll account for ${escapeHtml(input.to)}.`],
    { label: "Choose a new password", url: input.resetUrl },
    [`The link works once, for ${input.validMinutes} minutes.`, `If it was not you, ignore this e-mail: your password stays as it is.`],
  );
  return { to: input.to, subject, text, html };
}

/** One waiting proposal as the digest lists it. */
export type DigestProposal = { lessonTitle: string | null; proposedByName: string; note: string; createdAt: Date; isNew: boolean };

const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

/** The daily e-mail that tells a head of department which proposals wait for a decision on the Department shelf. */
export function proposalDigestMail(input: {
  to: string;
  headName: string;
  departmentName: string;
  proposals: DigestProposal[];
  proposalsUrl: string;
}): OutgoingMail {
  const count = input.proposals.length;
  const fresh = input.proposals.filter((proposal) => proposal.isNew).length;
  const waiting = count === 1 ? "1 proposal waits" : `${count} proposals wait`;
  const subject = `${waiting} for your decision on the ${input.departmentName} shelf`;
  const summary =
    fresh === 0
      ? "None is new since the last digest."
      : fresh === count
        ? "All of them are new since the last digest."
        : `${fresh} new since the last digest.`;
  const line = (proposal: DigestProposal) =>
    `${proposal.lessonTitle ?? "A lesson that was since deleted"}, proposed by ${proposal.proposedByName} on ${dayFormat.format(proposal.createdAt)}${proposal.isNew ? " (new)" : ""}`;
  const text = [
    `Hello ${input.headName},`,
    ``,
    `${waiting} for your decision on the Department shelf of ${input.departmentName}. ${summary}`,
    ``,
    ...input.proposals.flatMap((proposal) => [`- ${line(proposal)}`, ...(proposal.note ? [`  Note: ${proposal.note}`] : [])]),
    ``,
    `Read each lesson and approve or decline it here:`,
    input.proposalsUrl,
    ``,
    `You get this digest at most once a day, only while proposals are waiting.`,
  ].join("\n");
  const items = input.proposals
    .map(
      (proposal) =>
        `&bull; ${escapeHtml(line(proposal))}${proposal.note ? `<br><span style="color:#4a5a6a">Note: ${escapeHtml(proposal.note)}</span>` : ""}`,
    )
    .join("<br>");
  const html = layout(
    `${escapeHtml(waiting)} for your decision`,
    [
      `Hello ${escapeHtml(input.headName)},`,
      `${escapeHtml(waiting)} for your decision on the Department shelf of <strong>${escapeHtml(input.departmentName)}</strong>. ${escapeHtml(summary)}`,
      items,
    ],
    { label: "Decide on the proposals", url: input.proposalsUrl },
    [`You get this digest at most once a day, only while proposals are waiting.`],
  );
  return { to: input.to, subject, text, html };
}

/** The e-mail to an existing account when someone signs up again with its address (the sign-up page answers as for a new one). */
export function existingAccountMail(input: { to: string; name: string; signInUrl: string; resetUrl: string }): OutgoingMail {
  const subject = "You already have an Outroll account";
  const text = [
    `Hello ${input.name},`,
    ``,
    `Someone, perhaps you, just tried to create an Outroll account with this address, ${input.to}. You already have one, so no new account was made and nothing changed.`,
    ``,
    `Sign in here: ${input.signInUrl}`,
    `Forgotten your password? Choose a new one here: ${input.resetUrl}`,
    ``,
    `If it was not you, ignore this e-mail: your account and password are as they were.`,
  ].join("\n");
  const html = layout(
    "You already have an Outroll account",
    [
      `Hello ${escapeHtml(input.name)},`,
      `Someone, perhaps you, just tried to create an Outroll account with this address, ${escapeHtml(input.to)}. You already have one, so no new account was made and nothing changed.`,
    ],
    { label: "Sign in", url: input.signInUrl },
    [
      `Forgotten your password? <a href="${escapeHtml(input.resetUrl)}">Choose a new one</a>.`,
      `If it was not you, ignore this e-mail: your account and password are as they were.`,
    ],
  );
  return { to: input.to, subject, text, html };
}
