import { eq } from "drizzle-orm";
import { auth } from "../../server/auth";
import { db } from "../../server/db/client";
import { user } from "../../server/db/schema/index";
import { HttpAgent, uniqueEmail } from "./test-app";

export type DepartmentFixture = {
  departmentId: string;
  head: HttpAgent;
  headEmail: string;
  teachers: { agent: HttpAgent; email: string; userId: string }[];
};

/** Signs a new account up through the API and returns its agent (signed in), e-mail and user id. */
export async function signUpAgent(baseUrl: string, prefix: string, name = "Test Teacher") {
  const agent = new HttpAgent(baseUrl);
  const email = uniqueEmail(prefix);
  const response = await agent.post("/api/auth/sign-up/email", { name, email, password: "a-long-password" });
  if (response.status !== 200) throw new Error(`sign-up failed: ${response.status} ${response.text}`);
  return { agent, email, userId: response.body.user.id as string };
}

/**
 * A fresh department of its own (so tests never change the demo department): a head who created it through the API
 * and `teacherCount` teachers added as members the way the demo seed adds them.
 */
export async function createDepartment(baseUrl: string, label: string, teacherCount = 1): Promise<DepartmentFixture> {
  const head = await signUpAgent(baseUrl, `${label}-head`, "Rowan Head");
  const created = await head.agent.post("/api/departments", { name: `Maths, ${label} School` });
  if (created.status !== 201) throw new Error(`department not created: ${created.status} ${created.text}`);
  const departmentId = created.body.id as string;
  const teachers = [];
  for (let i = 0; i < teacherCount; i += 1) {
    const teacher = await signUpAgent(baseUrl, `${label}-teacher${i + 1}`, `Teacher ${i + 1}`);
    await auth.api.addMember({ body: { userId: teacher.userId, role: "teacher", organizationId: departmentId } });
    teachers.push(teacher);
  }
  return { departmentId, head: head.agent, headEmail: head.email, teachers };
}

/** The user id behind an e-mail address. */
export async function userIdFor(email: string) {
  const row = await db.query.user.findFirst({ where: eq(user.email, email) });
  if (!row) throw new Error(`no user ${email}`);
  return row.id;
}
