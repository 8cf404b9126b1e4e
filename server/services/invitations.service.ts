import type { IncomingHttpHeaders } from "node:http";
import { isAPIError } from "better-auth/api";
import { fromNodeHeaders } from "better-auth/node";
import type {
  AcceptedInvitation,
  InvitationPreview,
  InvitationState,
  PendingInvitation,
  SentInvitation,
} from "@shared/schemas/invitations";
import { auth } from "../auth";
import { accountExistsForEmail, findInvitationWithNames, listPendingInvitations, type InvitationRow } from "../db/queries/invitations";
import { env } from "../env";
import { HttpError } from "../http-error";
import { logger } from "../logger";
import { sendMail } from "../mail/mailer";
import { invitationMail } from "../mail/templates";
import type { TeacherContext } from "../middleware/require-teacher";

function departmentOf(teacher: TeacherContext) {
  if (!teacher.department) throw new HttpError(403, "no_department", "Join or create a department first.");
  return teacher.department;
}

function stateOf(row: Pick<InvitationRow, "status" | "expiresAt">): InvitationState {
  if (row.status === "pending") return row.expiresAt.getTime() <= Date.now() ? "expired" : "pending";
  if (row.status === "accepted" || row.status === "canceled" || row.status === "rejected") return row.status;
  return "canceled";
}

function pendingView(row: InvitationRow, inviterName: string): PendingInvitation {
  return {
    id: row.id,
    email: row.email,
    state: stateOf(row) === "expired" ? "expired" : "pending",
    expiresAt: row.expiresAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
    inviterName,
  };
}

/** The sign-up link the invitation e-mail carries. */
export function joinUrlFor(invitationId: string) {
  return `${env.appOrigin}/join?invitation=${encodeURIComponent(invitationId)}`;
}

const refusals: Record<Exclude<InvitationState, "pending">, [string, string]> = {
  expired: ["invitation_expired", "This invitation has expired. Ask your head of department to send a new one."],
  accepted: ["invitation_used", "This invitation has already been used. Sign in instead."],
  canceled: ["invitation_cancelled", "This invitation was cancelled by the head of department."],
  rejected: ["invitation_declined", "This invitation was declined."],
};

/** 410 Gone for an invitation that can no longer be used, saying why. */
function refusedInvitation(state: Exclude<InvitationState, "pending">) {
  const [code, message] = refusals[state];
  return new HttpError(410, code, message);
}

/** better-auth's refusals as our own error codes and messages. */
function fromAuthError(error: unknown, email: string): never {
  if (!isAPIError(error)) throw error;
  const code = (error.body as { code?: string } | undefined)?.code;
  switch (code) {
    case "USER_IS_ALREADY_A_MEMBER_OF_THIS_ORGANIZATION":
      throw new HttpError(409, "already_member", `${email} is already a member of your department.`);
    case "USER_IS_ALREADY_INVITED_TO_THIS_ORGANIZATION":
      throw new HttpError(409, "already_invited", `${email} already has an invitation waiting; use Resend in the list.`);
    case "INVITATION_LIMIT_REACHED":
      throw new HttpError(409, "invitation_limit", "Your department has too many invitations waiting; cancel some first.");
    case "INVITATION_NOT_FOUND":
      throw refusedInvitation("accepted");
    case "YOU_ARE_NOT_THE_RECIPIENT_OF_THE_INVITATION":
      throw new HttpError(403, "wrong_recipient", "This invitation is for another e-mail address.");
    default:
      throw new HttpError(error.statusCode >= 400 && error.statusCode < 500 ? error.statusCode : 500, "auth_refused", error.message);
  }
}

/** Sends the invitation e-mail over SMTP; a failed delivery keeps the invitation (it can be resent) and says so. */
async function deliver(row: InvitationRow, departmentName: string, inviterName: string) {
  try {
    await sendMail(invitationMail({ to: row.email, departmentName, inviterName, joinUrl: joinUrlFor(row.id), expiresAt: row.expiresAt }));
  } catch (error) {
    logger.error({ err: error }, "invitation e-mail not sent");
    throw new HttpError(
      502,
      "mail_not_sent",
      `The invitation for ${row.email} is saved, but the e-mail could not be sent. Try Resend in a moment.`,
    );
  }
}

/** The invitation as better-auth answers it, checked into our row shape. */
function invitationRowOf(value: unknown): InvitationRow {
  const row = value as InvitationRow & { expiresAt: Date | string; createdAt: Date | string };
  return { ...row, expiresAt: new Date(row.expiresAt), createdAt: new Date(row.createdAt ?? Date.now()) };
}

/** The head invites a colleague by address: a teacher invitation for 7 days, sent by e-mail. */
export async function inviteTeacher(teacher: TeacherContext, email: string, headers: IncomingHttpHeaders): Promise<SentInvitation> {
  const department = departmentOf(teacher);
  const waiting = await listPendingInvitations(department.id);
  if (waiting.some((row) => row.invitation.email.toLowerCase() === email && stateOf(row.invitation) === "pending")) {
    throw new HttpError(409, "already_invited", `${email} already has an invitation waiting; use Resend in the list.`);
  }
  let created: InvitationRow;
  try {
    created = invitationRowOf(
      await auth.api.createInvitation({
        body: { email, role: "teacher", organizationId: department.id },
        headers: fromNodeHeaders(headers),
      }),
    );
  } catch (error) {
    fromAuthError(error, email);
  }
  await deliver(created, department.name, teacher.user.name);
  return { invitation: pendingView(created, teacher.user.name), mailSent: true };
}

/** The department's invitations that have not been used or cancelled, expired ones included (they can be resent). */
export async function listInvitations(teacher: TeacherContext): Promise<PendingInvitation[]> {
  const rows = await listPendingInvitations(departmentOf(teacher).id);
  return rows.map((row) => pendingView(row.invitation, row.inviterName));
}

async function departmentInvitation(teacher: TeacherContext, invitationId: string) {
  const found = await findInvitationWithNames(invitationId);
  if (!found || found.invitation.organizationId !== departmentOf(teacher).id) {
    throw new HttpError(404, "not_found", "The invitation was not found.");
  }
  const state = stateOf(found.invitation);
  if (state !== "pending" && state !== "expired") throw refusedInvitation(state);
  return { ...found, state };
}

/** Sends the invitation again: a waiting one keeps its link and gets 7 more days; an expired one is replaced by a new link. */
export async function resendInvitation(
  teacher: TeacherContext,
  invitationId: string,
  headers: IncomingHttpHeaders,
): Promise<SentInvitation> {
  const department = departmentOf(teacher);
  const found = await departmentInvitation(teacher, invitationId);
  const authHeaders = fromNodeHeaders(headers);
  const email = found.invitation.email;
  let sent: InvitationRow;
  try {
    if (found.state === "expired") await auth.api.cancelInvitation({ body: { invitationId }, headers: authHeaders });
    sent = invitationRowOf(
      await auth.api.createInvitation({
        body: { email, role: "teacher", organizationId: department.id, resend: found.state === "pending" },
        headers: authHeaders,
      }),
    );
  } catch (error) {
    fromAuthError(error, email);
  }
  await deliver(sent, department.name, teacher.user.name);
  return { invitation: pendingView(sent, found.inviterName), mailSent: true };
}

/** The head cancels an invitation; its link stops working. */
export async function cancelInvitation(teacher: TeacherContext, invitationId: string, headers: IncomingHttpHeaders) {
  const found = await departmentInvitation(teacher, invitationId);
  try {
    await auth.api.cancelInvitation({ body: { invitationId }, headers: fromNodeHeaders(headers) });
  } catch (error) {
    fromAuthError(error, found.invitation.email);
  }
}

/** What the /join page shows before anyone signs in: the department, the inviter, the address and whether it still works. */
export async function previewInvitation(invitationId: string): Promise<InvitationPreview> {
  const found = await findInvitationWithNames(invitationId);
  if (!found) throw new HttpError(404, "invitation_not_found", "This invitation link is not known. Check that the whole link was copied.");
  return {
    id: found.invitation.id,
    email: found.invitation.email,
    departmentName: found.departmentName,
    inviterName: found.inviterName,
    state: stateOf(found.invitation),
    expiresAt: found.invitation.expiresAt.toISOString(),
    hasAccount: await accountExistsForEmail(found.invitation.email),
  };
}

/** The signed-in invited colleague joins the department as a teacher; the invitation works once, within 7 days. */
export async function acceptInvitation(
  teacher: TeacherContext,
  invitationId: string,
  headers: IncomingHttpHeaders,
): Promise<AcceptedInvitation> {
  const found = await findInvitationWithNames(invitationId);
  if (!found) throw new HttpError(404, "invitation_not_found", "This invitation link is not known. Check that the whole link was copied.");
  const state = stateOf(found.invitation);
  if (state !== "pending") throw refusedInvitation(state);
  if (found.invitation.email.toLowerCase() !== teacher.user.email.toLowerCase()) {
    throw new HttpError(
      403,
      "wrong_recipient",
      `This invitation is for ${found.invitation.email}, but you are signed in as ${teacher.user.email}. Sign out and use the invited address.`,
    );
  }
  if (teacher.department) {
    const same = teacher.department.id === found.invitation.organizationId;
    throw new HttpError(
      409,
      same ? "already_member" : "already_in_department",
      same
        ? `You are already a member of ${teacher.department.name}.`
        : `You already belong to ${teacher.department.name}; Outroll keeps one department per teacher.`,
    );
  }
  try {
    await auth.api.acceptInvitation({ body: { invitationId }, headers: fromNodeHeaders(headers) });
  } catch (error) {
    fromAuthError(error, found.invitation.email);
  }
  return { department: { id: found.invitation.organizationId, name: found.departmentName }, role: "teacher" };
}
