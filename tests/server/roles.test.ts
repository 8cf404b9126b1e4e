import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
const head = demoTeachers.find((t) => t.role === "head")!;
const teacher = demoTeachers.find((t) => t.role === "teacher")!;

beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("401 and 403 role checks", () => {
  it("answers 401 in the shared error shape without a session", async () => {
    const agent = new HttpAgent(app.baseUrl);
    for (const [method, path] of [
      ["GET", "/api/me"],
      ["GET", "/api/departments/current/members"],
      ["PATCH", "/api/departments/current"],
    ] as const) {
      const response = await agent.request(method, path, method === "PATCH" ? { name: "Maths, Elsewhere" } : undefined);
      expect(response.status, `${method} ${path}`).toBe(401);
      expect(response.body).toEqual({ error: { code: "unauthenticated", message: "Sign in to continue." } });
    }
  });

  it("answers 403 when a teacher tries what only the head of department may do", async () => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.signIn(teacher.email, demoPassword);
    const response = await agent.patch("/api/departments/current", { name: "Maths, Renamed" });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("forbidden");
  });

  it("lets the head of department do it, and both roles read the department", async () => {
    const headAgent = new HttpAgent(app.baseUrl);
    await headAgent.signIn(head.email, demoPassword);
    const members = await headAgent.get("/api/departments/current/members");
    expect(members.status).toBe(200);
    const emails = members.body.members.map((m: { email: string }) => m.email).sort();
    expect(emails).toEqual(demoTeachers.map((t) => t.email).sort());

    const teacherAgent = new HttpAgent(app.baseUrl);
    await teacherAgent.signIn(teacher.email, demoPassword);
    expect((await teacherAgent.get("/api/departments/current/members")).status).toBe(200);

    const original = (await headAgent.get("/api/me")).body.department.name;
    const renamed = await headAgent.patch("/api/departments/current", { name: `${original} (renamed)` });
    expect(renamed.status).toBe(200);
    expect(renamed.body.name).toBe(`${original} (renamed)`);
    await headAgent.patch("/api/departments/current", { name: original });
  });

  it("answers 403 for a signed-in teacher who has no department yet", async () => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.post("/api/auth/sign-up/email", {
      name: "Lone Teacher",
      email: `lone-${crypto.randomUUID().slice(0, 6)}@outroll-tests.test`,
      password: "a-long-password",
    });
    const response = await agent.get("/api/departments/current/members");
    expect(response.status).toBe(403);
  });

  it("answers an unknown API route with 404 in the shared error shape", async () => {
    const response = await new HttpAgent(app.baseUrl).get("/api/no-such-thing");
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe("not_found");
  });

  it("refuses a JSON body over the size limit with 413", async () => {
    const agent = new HttpAgent(app.baseUrl);
    await agent.signIn(head.email, demoPassword);
    const response = await agent.request("PATCH", "/api/departments/current", JSON.stringify({ name: "x".repeat(300_000) }));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("too_large");
  });
});
