import { eq } from "drizzle-orm";
import { departmentRoleSchema, type DepartmentRole } from "@shared/schemas/roles";
import { db } from "../client";
import { member, organization } from "../schema/index";

export type Membership = { departmentId: string; departmentName: string; role: DepartmentRole };

/** The department a user belongs to (Outroll keeps one per teacher), or null. */
export async function findMembershipForUser(userId: string): Promise<Membership | null> {
  const rows = await db
    .select({ departmentId: organization.id, departmentName: organization.name, role: member.role })
    .from(member)
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(eq(member.userId, userId))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  const role = departmentRoleSchema.safeParse(row.role);
  return { departmentId: row.departmentId, departmentName: row.departmentName, role: role.success ? role.data : "teacher" };
}
