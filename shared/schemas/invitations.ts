import { z } from "zod";
import { passwordSchema, signUpSchema } from "./account";

/** Body of POST /api/invitations: the colleague's school e-mail address. */
export const inviteTeacherSchema = z.object({
  email: z
    .email("Enter an e-mail address such as name@school.test.")
    .max(254, "That e-mail address is too long.")
    .transform((email) => email.toLowerCase()),
});
export type InviteTeacherInput = z.input<typeof inviteTeacherSchema>;

/** Invitation ids are opaque; they only travel in the invitation e-mail's link. */
export const invitationIdParamsSchema = z.object({
  id: z.string().trim().min(8, "That is not an invitation id.").max(64, "That is not an invitation id."),
});

/** Query of the /join page: /join?invitation=<id>. */
export const joinQuerySchema = z.object({ invitation: invitationIdParamsSchema.shape.id });

/** What the invited colleague fills in on the /join page when they have no account yet (the e-mail is the invitation's). */
export const joinSignUpSchema = z.object({ name: signUpSchema.shape.name, password: passwordSchema });
export type JoinSignUpInput = z.infer<typeof joinSignUpSchema>;

/** What an invited colleague with an account fills in: their password (the e-mail is the invitation's). */
export const joinSignInSchema = z.object({ password: z.string().min(1, "Enter your password.") });
export type JoinSignInInput = z.infer<typeof joinSignInSchema>;

export const invitationStates = ["pending", "expired", "accepted", "canceled", "rejected"] as const;
export type InvitationState = (typeof invitationStates)[number];

export const invitationStateLabels: Record<InvitationState, string> = {
  pending: "Waiting to be used",
  expired: "Expired",
  accepted: "Used",
  canceled: "Cancelled",
  rejected: "Declined",
};

/** A pending invitation as the head of department's list shows it (GET /api/invitations). */
export type PendingInvitation = {
  id: string;
  email: string;
  state: Extract<InvitationState, "pending" | "expired">;
  expiresAt: string;
  createdAt: string;
  inviterName: string;
};

/** What POST /api/invitations and POST /api/invitations/:id/resend answer. */
export type SentInvitation = { invitation: PendingInvitation; mailSent: true };

/** What the /join page may know before anyone signs in (GET /api/invitations/:id/preview). */
export type InvitationPreview = {
  id: string;
  email: string;
  departmentName: string;
  inviterName: string;
  state: InvitationState;
  expiresAt: string;
  /** Whether an Outroll account with the invited address exists, so the page offers sign-in instead of sign-up. */
  hasAccount: boolean;
};

/** What POST /api/invitations/:id/accept answers. */
export type AcceptedInvitation = { department: { id: string; name: string }; role: "teacher" };
