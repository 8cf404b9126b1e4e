import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { HttpAgent, startTestApp, uniqueEmail, type TestApp } from "../helpers/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("sign-up, sign-in and sign-out over HTTP", () => {
  it("signs a new teacher up, makes them head of a new department, and signs them out", async () => {
    const agent = new HttpAgent(app.baseUrl);
    const email = uniqueEmail("new-head");
    const signUp = await agent.post("/api/auth/sign-up/email", { name: "Rowan Mercer", email, password: "a-long-password" });
    expect(signUp.status).toBe(200);

    const before = await agent.get("/api/me");
    expect(before.status).toBe(200);
    expect(before.body).toMatchObject({ user: { email }, department: null, role: null });

    const department = await agent.post("/api/departments", { name: "Maths, Saltmarsh School" });
    expect(department.status).toBe(201);
    expect(department.body).toMatchObject({ name: "Maths, Saltmarsh School", role: "head" });

    const me = await agent.get("/api/me");
    expect(me.body).toMatchObject({ department: { name: "Maths, Saltmarsh School" }, role: "head" });

    expect((await agent.post("/api/auth/sign-out")).status).toBe(200);
    expect((await agent.get("/api/me")).status).toBe(401);
  });

  it("signs an existing teacher in with the right password only", async () => {
    const agent = new HttpAgent(app.baseUrl);
    const email = uniqueEmail("returning");
    await agent.post("/api/auth/sign-up/email", { name: "Ines Barlow", email, password: "correct-horse-1" });
    await agent.post("/api/auth/sign-out");

    const wrong = await agent.post("/api/auth/sign-in/email", { email, password: "not-the-password" });
    expect(wrong.status).toBe(401);
    expect((await agent.get("/api/me")).status).toBe(401);

    const right = await agent.post("/api/auth/sign-in/email", { email, password: "correct-horse-1" });
    expect(right.status).toBe(200);
    expect((await agent.get("/api/me")).body.user.email).toBe(email);
  });

  it("refuses a password shorter than ten characters", async () => {
    const agent = new HttpAgent(app.baseUrl);
    const response = await agent.post("/api/auth/sign-up/email", { name: "Short Pass", email: uniqueEmail("short"), password: "tiny" });
    expect(response.status).toBe(400);
  });

  it("refuses a second department for a teacher who already has one", async () => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.post("/api/auth/sign-up/email", { name: "Noor Hale", email: uniqueEmail("twice"), password: "a-long-password" });
    expect((await agent.post("/api/departments", { name: "Maths, First School" })).status).toBe(201);
    const second = await agent.post("/api/departments", { name: "Maths, Second School" });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("already_in_department");
  });

  it("answers a bad department name with field errors", async () => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.post("/api/auth/sign-up/email", { name: "Olu Finch", email: uniqueEmail("badname"), password: "a-long-password" });
    const response = await agent.post("/api/departments", { name: "x" });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(response.body.error.fields.name[0]).toMatch(/Name your department/);
  });
});

describe("sign-in rate limit", () => {
  it("answers 429 with our error shape once the per-minute limit is used up", async () => {
    const limited = await startTestApp({ signInLimitPerMinute: 3 });
    try {
      const agent = new HttpAgent(limited.baseUrl);
      const statuses: number[] = [];
      for (let i = 0; i < 4; i += 1) {
        statuses.push(
          (await agent.post("/api/auth/sign-in/email", { email: "nobody@outroll-tests.test", password: "whatever-it-is" })).status,
        );
      }
      expect(statuses.slice(0, 3).every((status) => status === 401)).toBe(true);
      expect(statuses[3]).toBe(429);
      const last = await agent.post("/api/auth/sign-in/email", { email: "nobody@outroll-tests.test", password: "whatever-it-is" });
      expect(last.body.error.code).toBe("too_many_attempts");
    } finally {
      await limited.close();
    }
  });
});
