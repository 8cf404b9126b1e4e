import { and, desc, eq, sql } from "drizzle-orm";
import { db } from "../client";
import { invitation, organization, user } from "../schema/index";

export type InvitationRow = typeof invitation.$inferSelect;

/** A department's invitations still marked pending (some may have expired), newest first, with the inviter's name. */
export async function listPendingInvitations(departmentId: string) {
  return db
    .select({ invitation, inviterName: user.name })
    .from(invitation)
    .innerJoin(user, eq(invitation.inviterId, user.id))
    .where(and(eq(invitation.organizationId, departmentId), eq(invitation.status, "pending")))
    .orderBy(desc(invitation.createdAt));
}

/** One invitation with its department's and inviter's names, or null. */
export async function findInvitationWithNames(id: string) {
  const [row] = await db
    .select({ invitation, departmentName: organization.name, inviterName: user.name })
    .from(invitation)
    .innerJoin(organization, eq(invitation.organizationId, organization.id))
    .innerJoin(user, eq(invitation.inviterId, user.id))
    .where(eq(invitation.id, id))
    .limit(1);
  return row ?? null;
}

/** Whether an account with this e-mail address exists (addresses compared without case). */
export async function accountExistsForEmail(email: string) {
  const [row] = await db
    .select({ id: user.id })
    .from(user)
    .where(eq(sql`lower(${user.email})`, email.toLowerCase()))
    .limit(1);
  return Boolean(row);
}
