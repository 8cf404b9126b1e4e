import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { INVITATION_DAYS, SESSION_DAYS } from "@shared/schemas/privacy";
import type { TestApp } from "../helpers/test-app";

// The controller is an environment setting read once at start, so it is set before the app's modules load.
process.env.PRIVACY_CONTROLLER_NAME = "Harbourside Academy Trust";
process.env.PRIVACY_CONTROLLER_EMAIL = "privacy@harbourside.test";
delete process.env.PRIVACY_CONTROLLER_ADDRESS;

let app: TestApp;
let HttpAgent: typeof import("../helpers/test-app").HttpAgent;

beforeAll(async () => {
  const helpers = await import("../helpers/test-app");
  HttpAgent = helpers.HttpAgent;
  app = await helpers.startTestApp();
});
afterAll(() => app.close());

describe("the privacy notice's settings", () => {
  it("tells a signed-out visitor who the controller is, from the environment", async () => {
    const response = await new HttpAgent(app.baseUrl).get("/api/privacy");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      controller: { name: "Harbourside Academy Trust", email: "privacy@harbourside.test", postalAddress: null },
    });
  });

  it("states the same session and invitation lifetimes as the sign-in configuration uses", async () => {
    const { auth } = await import("../../server/auth");
    expect(auth.options.session?.expiresIn).toBe(SESSION_DAYS * 24 * 60 * 60);
    const organization = auth.options.plugins?.find((plugin) => plugin.id === "organization") as
      { options?: { invitationExpiresIn?: number } } | undefined;
    expect(organization?.options?.invitationExpiresIn).toBe(INVITATION_DAYS * 24 * 60 * 60);
  });

  it("refuses a controller e-mail address that is not one when the environment is read", async () => {
    const { loadEnv } = await import("../../server/env");
    expect(() => loadEnv({ ...process.env, PRIVACY_CONTROLLER_EMAIL: "not an address" })).toThrow(/PRIVACY_CONTROLLER_EMAIL/);
    expect(loadEnv({ ...process.env, PRIVACY_CONTROLLER_NAME: undefined }).PRIVACY_CONTROLLER_NAME).toBeUndefined();
  });
});
