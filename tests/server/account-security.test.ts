import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "../../server/db/client";
import { user } from "../../server/db/schema/index";
import { mailFor, waitForMail } from "../helpers/mailbox";
import { HttpAgent, startTestApp, uniqueEmail, type TestApp } from "../helpers/test-app";

let app: TestApp;
// The per-address limit is generous here, so the per-account limit is what these tests meet.
beforeAll(async () => {
  app = await startTestApp({ signInLimitPerMinute: 1000 });
});
afterAll(() => app.close());

const strongPassword = "tidal-pool-lantern-42";

async function signedUp(prefix: string, name = "Rowan Mercer") {
  const agent = new HttpAgent(app.baseUrl);
  const email = uniqueEmail(prefix);
  const response = await agent.post("/api/auth/sign-up/email", { name, email, password: strongPassword });
  expect(response.status, response.text).toBe(200);
  return { agent, email };
}

async function storedUser(email: string) {
  return db.query.user.findFirst({ where: eq(user.email, email) });
}

describe("account bodies and names", () => {
  it("refuses a sign-up body over the limit before better-auth reads it, storing nothing", async () => {
    const email = uniqueEmail("huge-name");
    const response = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", {
      name: "N".repeat(8 * 1024 * 1024),
      email,
      password: strongPassword,
    });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("too_large");
    expect(await storedUser(email)).toBeUndefined();
  });

  it("holds sign-up names to 2–80 characters", async () => {
    for (const name of ["R", "R".repeat(81), "   "]) {
      const email = uniqueEmail("bad-name");
      const response = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", { name, email, password: strongPassword });
      expect(response.status, name.slice(0, 10)).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(await storedUser(email)).toBeUndefined();
    }
  });

  it("holds update-user to the same name rule and body limit", async () => {
    const { agent, email } = await signedUp("rename");
    expect((await agent.post("/api/auth/update-user", { name: "N".repeat(5 * 1024 * 1024) })).status).toBe(413);
    const long = await agent.post("/api/auth/update-user", { name: "N".repeat(200) });
    expect(long.status).toBe(400);
    expect(long.body.error.message).toMatch(/at most 80/);
    expect((await agent.post("/api/auth/update-user", { name: "R" })).status).toBe(400);
    expect((await storedUser(email))?.name).toBe("Rowan Mercer");
    expect((await agent.post("/api/auth/update-user", { name: "Rowan M. Mercer" })).status).toBe(200);
    expect((await storedUser(email))?.name).toBe("Rowan M. Mercer");
  });
});

describe("passwords", () => {
  it("refuses new passwords on common lists or of repeated characters, with a reason", async () => {
    for (const password of ["password12", " ".repeat(10), "qwertyuiop", "Password1234"]) {
      const email = uniqueEmail("weak");
      const response = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", { name: "Wren Calder", email, password });
      expect(response.status, password).toBe(400);
      expect(response.body.error.code).toBe("weak_password");
      expect(response.body.error.message).toMatch(/too easy to guess/);
      expect(await storedUser(email)).toBeUndefined();
    }
  });

  it("refuses a weak new password when a signed-in teacher changes it", async () => {
    const { agent } = await signedUp("change");
    const weak = await agent.post("/api/auth/change-password", { currentPassword: strongPassword, newPassword: "password12" });
    expect(weak.status).toBe(400);
    expect(weak.body.error.code).toBe("weak_password");
    const strong = await agent.post("/api/auth/change-password", {
      currentPassword: strongPassword,
      newPassword: "harbour-kelp-compass-7",
    });
    expect(strong.status).toBe(200);
  });

  it("makes an account wait after five wrong passwords from any address, leaving other accounts alone", async () => {
    const { email } = await signedUp("locked");
    const { email: neighbour } = await signedUp("neighbour");
    const attacker = new HttpAgent(app.baseUrl);
    for (let attempt = 0; attempt < 5; attempt += 1) {
      expect((await attacker.post("/api/auth/sign-in/email", { email, password: `wrong-guess-${attempt}` })).status).toBe(401);
    }
    const owner = new HttpAgent(app.baseUrl);
    const refused = await owner.post("/api/auth/sign-in/email", { email, password: strongPassword });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe("too_many_attempts");
    expect(refused.body.error.message).toMatch(/Wait \d+ minutes/);
    expect((await owner.post("/api/auth/sign-in/email", { email: neighbour, password: strongPassword })).status).toBe(200);
  });
});

describe("forwarded addresses", () => {
  async function statusesWithRotatingAddresses(target: TestApp) {
    const agent = new HttpAgent(target.baseUrl);
    const statuses: number[] = [];
    for (let i = 0; i < 4; i += 1) {
      const response = await agent.request(
        "POST",
        "/api/auth/sign-in/email",
        { email: uniqueEmail("nobody"), password: "whatever-it-is" },
        { "x-forwarded-for": `203.0.113.${i + 1}` },
      );
      statuses.push(response.status);
    }
    return statuses;
  }

  it("ignores X-Forwarded-For unless it comes from the configured proxy", async () => {
    const direct = await startTestApp({ signInLimitPerMinute: 3 });
    try {
      expect(await statusesWithRotatingAddresses(direct)).toEqual([401, 401, 401, 429]);
    } finally {
      await direct.close();
    }
    const behindProxy = await startTestApp({ signInLimitPerMinute: 3, trustProxy: ["loopback"] });
    try {
      expect(await statusesWithRotatingAddresses(behindProxy)).toEqual([401, 401, 401, 401]);
    } finally {
      await behindProxy.close();
    }
  });
});

describe("account existence", () => {
  it("answers a sign-up with an existing address as it answers a new one, and tells the owner by e-mail", async () => {
    const { email } = await signedUp("existing", "Ines Barlow");
    const again = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", {
      name: "Someone Else",
      email,
      password: "another-sturdy-phrase-9",
    });
    const fresh = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", {
      name: "Someone Else",
      email: uniqueEmail("fresh"),
      password: "another-sturdy-phrase-9",
    });
    expect(again.status).toBe(200);
    expect(again.status).toBe(fresh.status);
    expect(again.text).not.toMatch(/already exists/i);
    const shape = (body: { token: unknown; user: Record<string, unknown> }) => ({
      token: body.token,
      userKeys: Object.keys(body.user).sort(),
      name: body.user.name,
    });
    expect(shape(again.body)).toEqual(shape(fresh.body));
    const mail = await waitForMail(email, /already have an Outroll account/);
    expect(mail.text).toContain("no new account was made");
    expect((await storedUser(email))?.name).toBe("Ines Barlow");
    // A password over the length limit is refused alike too, before anyone looks the address up.
    const tooLong = "tidal-pool-lantern-".repeat(8);
    const longAgain = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", { name: "Someone Else", email, password: tooLong });
    const longFresh = await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", {
      name: "Someone Else",
      email: uniqueEmail("fresh"),
      password: tooLong,
    });
    expect([longAgain.status, longAgain.body.error]).toEqual([longFresh.status, longFresh.body.error]);
    expect(longAgain.status).toBe(400);
  });

  it("answers a password-reset request for an existing and an unknown address alike, and mails only the existing one", async () => {
    const { email } = await signedUp("reset-known");
    const unknown = uniqueEmail("reset-unknown");
    const known = await new HttpAgent(app.baseUrl).post("/api/auth/request-password-reset", { email, redirectTo: "/reset-password" });
    const stranger = await new HttpAgent(app.baseUrl).post("/api/auth/request-password-reset", {
      email: unknown,
      redirectTo: "/reset-password",
    });
    expect(known.status).toBe(stranger.status);
    expect(known.text).toBe(stranger.text);
    await waitForMail(email, /password/i);
    expect(await mailFor(unknown)).toEqual([]);
  });
});
