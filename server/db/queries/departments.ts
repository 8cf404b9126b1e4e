import { asc, eq } from "drizzle-orm";
import { db } from "../client";
import { member, organization, user } from "../schema/index";

/** Every member of a department with their role, heads first. */
export async function listDepartmentMembers(departmentId: string) {
  const rows = await db
    .select({ userId: user.id, name: user.name, email: user.email, role: member.role, joinedAt: member.createdAt })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(eq(member.organizationId, departmentId))
    .orderBy(asc(member.role), asc(user.name));
  return rows;
}

export async function renameDepartment(departmentId: string, name: string) {
  const [row] = await db
    .update(organization)
    .set({ name })
    .where(eq(organization.id, departmentId))
    .returning({ id: organization.id, name: organization.name });
  return row;
}
