import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements } from "better-auth/plugins/organization/access";
import { db } from "./db/client";
import * as schema from "./db/schema/index";
import { env } from "./env";

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

const trustedOrigins = Array.from(
  new Set([env.appOrigin, env.appOrigin.replace("127.0.0.1", "localhost"), "http://127.0.0.1:5173", "http://localhost:5173"]),
);

export const auth = betterAuth({
  appName: "Outroll",
  logger: { level: env.NODE_ENV === "test" ? "error" : "warn" },
  baseURL: env.appOrigin,
  basePath: "/api/auth",
  secret: env.authSecret,
  trustedOrigins,
  database: drizzleAdapter(db, { provider: "pg", schema }),
  emailAndPassword: { enabled: true, minPasswordLength: 10, maxPasswordLength: 128, autoSignIn: true },
  session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
  // Our own limiter guards sign-in (see app.ts); better-auth's keys on IP alone and a school shares one.
  rateLimit: { enabled: false },
  advanced: { database: { generateId: () => crypto.randomUUID() } },
  plugins: [
    organization({
      ac: accessControl,
      roles: departmentRoles,
      creatorRole: "head",
      allowUserToCreateOrganization: true,
      organizationLimit: 1,
      invitationExpiresIn: 60 * 60 * 24 * 7,
    }),
  ],
});

export type Auth = typeof auth;
