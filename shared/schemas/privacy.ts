/** How long a signed-in session lasts without use, in days (better-auth's session.expiresIn in server/auth.ts). */
export const SESSION_DAYS = 14;

/** How long an invitation link works, in days (the organization plugin's invitationExpiresIn in server/auth.ts). */
export const INVITATION_DAYS = 7;

/** The school or organisation responsible for the data this Outroll holds, as the operator configured it. */
export type PrivacyController = { name: string; email: string | null; postalAddress: string | null };

/** GET /api/privacy: the controller's contact for the privacy notice; null until the operator sets it. */
export type PrivacyNoticeSettings = { controller: PrivacyController | null };
