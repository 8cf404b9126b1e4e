import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements } from "better-auth/plugins/organization/access";
import { db } from "./db/client";
import * as schema from "./db/schema/index";
import { PASSWORD_RESET_MINUTES } from "@shared/schemas/password-reset";
import { accountHooks, steadyAuthHandler } from "./account-guards";
import { env } from "./env";
import { logger } from "./logger";
import { sendMail } from "./mail/mailer";
import { passwordResetMail } from "./mail/templates";
import { trustedOrigins } from "./middleware/same-origin";

const accessControl = createAccessControl(defaultStatements);

/** better-auth's own permissions for our two department roles; Outroll's routes check roles themselves too. */
const departmentRoles = {
  head: accessControl.newRole({
    organization: ["update"],
    member: ["create", "update", "delete"],
    invitation: ["create", "cancel"],
  }),
  teacher: accessControl.newRole({ organization: [], member: [], invitation: [] }),
};

export const auth = betterAuth({
  appName: "Outroll",
  logger: { level: env.NODE_ENV === "test" ? "error" : "warn" },
  baseURL: env.appOrigin,
  basePath: "/api/auth",
  secret: env.authSecret,
  trustedOrigins,
  database: drizzleAdapter(db, { provider: "pg", schema }),
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 10,
    maxPasswordLength: 128,
    autoSignIn: true,
    resetPasswordTokenExpiresIn: PASSWORD_RESET_MINUTES * 60,
    revokeSessionsOnPasswordReset: true,
    // The link opens our own /reset-password page. The mail goes out after the answer, which is the same for any
    // address, so waiting for the mail server cannot tell an existing account from an unknown one.
    sendResetPassword: async ({ user, token }) => {
      const resetUrl = `${env.appOrigin}/reset-password?token=${encodeURIComponent(token)}`;
      sendMail(passwordResetMail({ to: user.email, name: user.name, resetUrl, validMinutes: PASSWORD_RESET_MINUTES })).catch(
        (error: unknown) => logger.error({ err: error }, "password reset e-mail not sent"),
      );
    },
  },
  // Invitations go through /api/invitations (services/invitations.service.ts), which checks roles and sends the e-mail.
  disabledPaths: [
    "/organization/invite-member",
    "/organization/accept-invitation",
    "/organization/reject-invitation",
    "/organization/cancel-invitation",
    "/organization/get-invitation",
    "/organization/list-invitations",
    "/organization/list-user-invitations",
  ],
  // Name rules, password strength, the per-account sign-in wait and the sign-up of an existing address (account-guards.ts).
  hooks: accountHooks,
  session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
  // Our own limiter guards sign-in (see app.ts); better-auth's keys on IP alone and a school shares one.
  rateLimit: { enabled: false },
  // Behind HTTPS (APP_ORIGIN https:) session cookies are Secure and __Secure- prefixed.
  advanced: { database: { generateId: () => crypto.randomUUID() }, useSecureCookies: env.https },
  plugins: [
    organization({
      ac: accessControl,
      roles: departmentRoles,
      creatorRole: "head",
      allowUserToCreateOrganization: true,
      organizationLimit: 1,
      invitationExpiresIn: 60 * 60 * 24 * 7,
      // Invitation ids are random UUIDs that reach only the invited mailbox, so following the link proves the address.
      requireEmailVerificationOnInvitation: false,
    }),
  ],
});

export type Auth = typeof auth;

/** What app.ts mounts at /api/auth: better-auth behind steady answers and our error shape. */
export const authRequestHandler = steadyAuthHandler(auth.handler);
