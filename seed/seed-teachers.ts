import { eq } from "drizzle-orm";
import { auth } from "../server/auth";
import type { Database } from "../server/db/client";
import { member, organization, user } from "../server/db/schema/index";
import { demoDepartment, demoPassword, demoTeachers } from "./demo-scenario";

async function ensureUser(db: Database, teacher: (typeof demoTeachers)[number]): Promise<string> {
  const existing = await db.query.user.findFirst({ where: eq(user.email, teacher.email) });
  if (existing) return existing.id;
  const created = await auth.api.signUpEmail({ body: { name: teacher.name, email: teacher.email, password: demoPassword } });
  return created.user.id;
}

/** The demo department with its head and two teachers; running it again changes nothing. */
export async function seedTeachers(db: Database) {
  const ids = new Map<string, string>();
  for (const teacher of demoTeachers) ids.set(teacher.email, await ensureUser(db, teacher));

  const head = demoTeachers.find((t) => t.role === "head")!;
  let department = await db.query.organization.findFirst({ where: eq(organization.slug, demoDepartment.slug) });
  if (!department) {
    await auth.api.createOrganization({ body: { ...demoDepartment, userId: ids.get(head.email)! } });
    department = await db.query.organization.findFirst({ where: eq(organization.slug, demoDepartment.slug) });
  }
  const departmentId = department!.id;
  const members = await db.select({ userId: member.userId }).from(member).where(eq(member.organizationId, departmentId));
  const present = new Set(members.map((m) => m.userId));
  for (const teacher of demoTeachers) {
    const userId = ids.get(teacher.email)!;
    if (!present.has(userId)) {
      await auth.api.addMember({ body: { userId, role: teacher.role, organizationId: departmentId } });
    }
  }
  return { departmentId, teacherIds: ids };
}
