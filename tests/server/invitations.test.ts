import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "../../server/db/client";
import { invitation } from "../../server/db/schema/index";
import { createDepartment, signUpAgent, type DepartmentFixture } from "../helpers/department-fixtures";
import { linkIn, mailFor, waitForMail } from "../helpers/mailbox";
import { HttpAgent, startTestApp, uniqueEmail, type TestApp } from "../helpers/test-app";

let app: TestApp;
let ours: DepartmentFixture;
let theirs: DepartmentFixture;

beforeAll(async () => {
  app = await startTestApp({ signInLimitPerMinute: 1000 });
  ours = await createDepartment(app.baseUrl, "invite-ours", 1);
  theirs = await createDepartment(app.baseUrl, "invite-theirs", 1);
});
afterAll(() => app.close());

async function invite(agent: HttpAgent, email: string) {
  const response = await agent.post("/api/invitations", { email });
  expect(response.status, response.text).toBe(201);
  return response.body.invitation as { id: string; email: string; expiresAt: string; state: string };
}

/** The invitation id carried by the link in the newest invitation e-mail to `email`. */
async function invitationIdFromMail(email: string) {
  const message = await waitForMail(email, /invites you to join/);
  const link = linkIn(message, "/join");
  return { id: link.searchParams.get("invitation")!, message, link };
}

describe("who may use the invitation routes", () => {
  it("answers 401 to a signed-out visitor on every route that needs a session", async () => {
    const visitor = new HttpAgent(app.baseUrl);
    const pending = await invite(ours.head, uniqueEmail("matrix-signed-out"));
    for (const [method, path, body] of [
      ["GET", "/api/invitations", undefined],
      ["POST", "/api/invitations", { email: uniqueEmail("nobody") }],
      ["POST", `/api/invitations/${pending.id}/resend`, {}],
      ["DELETE", `/api/invitations/${pending.id}`, undefined],
      ["POST", `/api/invitations/${pending.id}/accept`, {}],
    ] as const) {
      const response = await visitor.request(method, path, body);
      expect(response.status, `${method} ${path}`).toBe(401);
      expect(response.body.error.code).toBe("unauthenticated");
    }
  });

  it("answers 403 to a teacher of the department: only the head of department invites", async () => {
    const teacher = ours.teachers[0].agent;
    const pending = await invite(ours.head, uniqueEmail("matrix-teacher"));
    for (const [method, path, body] of [
      ["GET", "/api/invitations", undefined],
      ["POST", "/api/invitations", { email: uniqueEmail("by-teacher") }],
      ["POST", `/api/invitations/${pending.id}/resend`, {}],
      ["DELETE", `/api/invitations/${pending.id}`, undefined],
    ] as const) {
      const response = await teacher.request(method, path, body);
      expect(response.status, `${method} ${path}`).toBe(403);
      expect(response.body.error.code).toBe("forbidden");
    }
  });

  it("keeps another department out: its teacher gets 403, its head 404 on our invitations and sees none of them", async () => {
    const pending = await invite(ours.head, uniqueEmail("matrix-other"));
    const otherTeacher = theirs.teachers[0].agent;
    expect((await otherTeacher.get("/api/invitations")).status).toBe(403);
    expect((await otherTeacher.post(`/api/invitations/${pending.id}/resend`)).status).toBe(403);

    const otherHead = theirs.head;
    expect((await otherHead.post(`/api/invitations/${pending.id}/resend`)).status).toBe(404);
    expect((await otherHead.delete(`/api/invitations/${pending.id}`)).status).toBe(404);
    const list = await otherHead.get("/api/invitations");
    expect(list.status).toBe(200);
    expect(list.body.invitations.map((i: { id: string }) => i.id)).not.toContain(pending.id);
  });

  it("lets the head of department list, invite, resend and cancel", async () => {
    const email = uniqueEmail("matrix-head");
    const pending = await invite(ours.head, email);
    const list = await ours.head.get("/api/invitations");
    expect(list.status).toBe(200);
    expect(list.body.invitations.find((i: { id: string }) => i.id === pending.id)).toMatchObject({ email, state: "pending" });
    expect((await ours.head.post(`/api/invitations/${pending.id}/resend`)).status).toBe(200);
    expect((await ours.head.delete(`/api/invitations/${pending.id}`)).status).toBe(204);
    const after = await ours.head.get("/api/invitations");
    expect(after.body.invitations.map((i: { id: string }) => i.id)).not.toContain(pending.id);
  });

  it("does not offer better-auth's own invitation endpoints over HTTP, so every invitation passes our checks", async () => {
    const response = await ours.head.post("/api/auth/organization/invite-member", {
      email: uniqueEmail("raw"),
      role: "teacher",
      organizationId: ours.departmentId,
    });
    expect(response.status).toBe(404);
  });
});

describe("an invitation by e-mail", () => {
  it("arrives at the fake SMTP server with a sign-up link that joins the department as a teacher", async () => {
    const email = uniqueEmail("newcomer");
    const created = await invite(ours.head, email);
    // 7 days = 604 800 s, better-auth's invitationExpiresIn as configured in server/auth.ts.
    const lifetime = new Date(created.expiresAt).getTime() - Date.now();
    expect(lifetime).toBeGreaterThan(7 * 24 * 3600 * 1000 - 60_000);
    expect(lifetime).toBeLessThanOrEqual(7 * 24 * 3600 * 1000);

    const { id, message, link } = await invitationIdFromMail(email);
    expect(id).toBe(created.id);
    expect(message.to).toEqual([email]);
    expect(message.subject).toBe("Rowan Head invites you to join Maths, invite-ours School on Outroll");
    expect(message.text).toContain(link.href);
    expect(message.html).toContain("Join the department");

    const visitor = new HttpAgent(app.baseUrl);
    const preview = await visitor.get(`/api/invitations/${id}/preview`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({
      email,
      departmentName: "Maths, invite-ours School",
      inviterName: "Rowan Head",
      state: "pending",
      hasAccount: false,
    });

    const signUp = await visitor.post("/api/auth/sign-up/email", { name: "Kit Marsh", email, password: "a-long-password" });
    expect(signUp.status).toBe(200);
    const accepted = await visitor.post(`/api/invitations/${id}/accept`);
    expect(accepted.status, accepted.text).toBe(200);
    expect(accepted.body).toEqual({ department: { id: ours.departmentId, name: "Maths, invite-ours School" }, role: "teacher" });

    const me = await visitor.get("/api/me");
    expect(me.body).toMatchObject({ user: { email }, department: { id: ours.departmentId }, role: "teacher" });
    const members = await ours.head.get("/api/departments/current/members");
    expect(members.body.members.find((m: { email: string }) => m.email === email)).toMatchObject({ role: "teacher" });
  });

  it("works once: the same link is refused the second time", async () => {
    const email = uniqueEmail("twice");
    await invite(ours.head, email);
    const { id } = await invitationIdFromMail(email);
    const { agent } = await (async () => {
      const agent = new HttpAgent(app.baseUrl);
      await agent.post("/api/auth/sign-up/email", { name: "Once Only", email, password: "a-long-password" });
      return { agent };
    })();
    expect((await agent.post(`/api/invitations/${id}/accept`)).status).toBe(200);
    const again = await agent.post(`/api/invitations/${id}/accept`);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("invitation_used");
    expect((await new HttpAgent(app.baseUrl).get(`/api/invitations/${id}/preview`)).body.state).toBe("accepted");
  });

  it("expires: a link past its expiry is refused, and Resend sends a new link that works", async () => {
    const email = uniqueEmail("late");
    await invite(ours.head, email);
    const { id } = await invitationIdFromMail(email);
    await db
      .update(invitation)
      .set({ expiresAt: new Date(Date.now() - 60_000) })
      .where(eq(invitation.id, id));

    const late = new HttpAgent(app.baseUrl);
    await late.post("/api/auth/sign-up/email", { name: "Late Comer", email, password: "a-long-password" });
    expect((await late.get(`/api/invitations/${id}/preview`)).body.state).toBe("expired");
    const refused = await late.post(`/api/invitations/${id}/accept`);
    expect(refused.status).toBe(410);
    expect(refused.body.error.code).toBe("invitation_expired");
    expect((await late.get("/api/me")).body.department).toBeNull();

    const listed = await ours.head.get("/api/invitations");
    expect(listed.body.invitations.find((i: { id: string }) => i.id === id)).toMatchObject({ state: "expired" });
    const resent = await ours.head.post(`/api/invitations/${id}/resend`);
    expect(resent.status, resent.text).toBe(200);
    const fresh = resent.body.invitation.id as string;
    expect(fresh).not.toBe(id);
    expect((await mailFor(email)).length).toBe(2);
    const { id: mailed } = await invitationIdFromMail(email);
    expect(mailed).toBe(fresh);
    expect((await late.post(`/api/invitations/${id}/accept`)).status).toBe(410);
    expect((await late.post(`/api/invitations/${fresh}/accept`)).status).toBe(200);
  });

  it("refuses a cancelled invitation", async () => {
    const email = uniqueEmail("cancelled");
    const { id } = await invite(ours.head, email);
    expect((await ours.head.delete(`/api/invitations/${id}`)).status).toBe(204);
    const agent = new HttpAgent(app.baseUrl);
    await agent.post("/api/auth/sign-up/email", { name: "Not Wanted", email, password: "a-long-password" });
    const response = await agent.post(`/api/invitations/${id}/accept`);
    expect(response.status).toBe(410);
    expect(response.body.error.code).toBe("invitation_cancelled");
  });

  it("refuses someone signed in with another address", async () => {
    const email = uniqueEmail("intended");
    const { id } = await invite(ours.head, email);
    const stranger = await signUpAgent(app.baseUrl, "stranger");
    const response = await stranger.agent.post(`/api/invitations/${id}/accept`);
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe("wrong_recipient");
    expect((await stranger.agent.get("/api/me")).body.department).toBeNull();
  });

  it("lets a colleague who already has an account sign in and join", async () => {
    const existing = await signUpAgent(app.baseUrl, "has-account", "Ira Existing");
    await existing.agent.post("/api/auth/sign-out");
    await invite(ours.head, existing.email);
    const { id } = await invitationIdFromMail(existing.email);
    const visitor = new HttpAgent(app.baseUrl);
    expect((await visitor.get(`/api/invitations/${id}/preview`)).body.hasAccount).toBe(true);
    await visitor.signIn(existing.email, "a-long-password");
    expect((await visitor.post(`/api/invitations/${id}/accept`)).status).toBe(200);
    expect((await visitor.get("/api/me")).body.role).toBe("teacher");
  });

  it("refuses a teacher who already belongs to another department", async () => {
    const teacherElsewhere = theirs.teachers[0];
    const { id } = await invite(ours.head, teacherElsewhere.email);
    const response = await teacherElsewhere.agent.post(`/api/invitations/${id}/accept`);
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe("already_in_department");
  });

  it("answers bad or repeated invitations with clear errors", async () => {
    const bad = await ours.head.post("/api/invitations", { email: "not-an-address" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("invalid_input");
    expect(bad.body.error.fields.email[0]).toMatch(/e-mail address/);

    const email = uniqueEmail("repeat");
    await invite(ours.head, email);
    const repeat = await ours.head.post("/api/invitations", { email: email.toUpperCase() });
    expect(repeat.status).toBe(409);
    expect(repeat.body.error.code).toBe("already_invited");

    const member = await ours.head.post("/api/invitations", { email: ours.teachers[0].email });
    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe("already_member");

    const unknown = await new HttpAgent(app.baseUrl).get("/api/invitations/00000000-0000-4000-8000-000000000000/preview");
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe("invitation_not_found");
  });
});

describe("password reset by e-mail", () => {
  it("mails a link whose token sets a new password once", async () => {
    const account = await signUpAgent(app.baseUrl, "forgetful", "Mo Forgetful");
    const request = await new HttpAgent(app.baseUrl).post("/api/auth/request-password-reset", { email: account.email });
    expect(request.status).toBe(200);

    const message = await waitForMail(account.email, /new Outroll password/);
    const link = linkIn(message, "/reset-password");
    const token = link.searchParams.get("token")!;
    expect(token.length).toBeGreaterThan(10);

    const visitor = new HttpAgent(app.baseUrl);
    const reset = await visitor.post("/api/auth/reset-password", { token, newPassword: "a-brand-new-password" });
    expect(reset.status, reset.text).toBe(200);
    expect((await visitor.post("/api/auth/sign-in/email", { email: account.email, password: "a-long-password" })).status).toBe(401);
    expect((await visitor.post("/api/auth/sign-in/email", { email: account.email, password: "a-brand-new-password" })).status).toBe(200);
    // Sessions from before the reset are signed out (revokeSessionsOnPasswordReset).
    expect((await account.agent.get("/api/me")).status).toBe(401);

    const reused = await visitor.post("/api/auth/reset-password", { token, newPassword: "yet-another-password" });
    expect(reused.status).toBe(400);
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    const email = uniqueEmail("no-such-account");
    const response = await new HttpAgent(app.baseUrl).post("/api/auth/request-password-reset", { email });
    expect(response.status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(await mailFor(email)).toEqual([]);
  });
});

describe("the development mail page's API", () => {
  it("lists what the fake mail server received, newest first, to requests from this machine", async () => {
    const email = uniqueEmail("dev-mail");
    await invite(ours.head, email);
    const response = await new HttpAgent(app.baseUrl).get("/api/dev/mail");
    expect(response.status).toBe(200);
    const first = response.body.messages.find((m: { to: string[] }) => m.to.includes(email));
    expect(first).toMatchObject({ subject: expect.stringContaining("invites you to join"), from: "Outroll <no-reply@outroll.test>" });
    expect(first.links.some((link: string) => link.includes("/join?invitation="))).toBe(true);
    const times = response.body.messages.map((m: { receivedAt: string }) => m.receivedAt);
    expect([...times].sort().reverse()).toEqual(times);
  });
});
