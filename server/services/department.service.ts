import { fromNodeHeaders } from "better-auth/node";
import type { IncomingHttpHeaders } from "node:http";
import { auth } from "../auth";
import { HttpError } from "../http-error";
import { findMembershipForUser } from "../db/queries/memberships";
import { listDepartmentMembers, renameDepartment } from "../db/queries/departments";
import type { TeacherContext } from "../middleware/require-teacher";

function slugFor(name: string): string {
  const base =
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 40) || "department";
  return `${base}-${crypto.randomUUID().slice(0, 8)}`;
}

/** Creates a department with the teacher as its head; a teacher belongs to one department at most. */
export async function createDepartment(teacher: TeacherContext, name: string, headers: IncomingHttpHeaders) {
  if (teacher.department) {
    throw new HttpError(409, "already_in_department", `You already belong to ${teacher.department.name}.`);
  }
  await auth.api.createOrganization({ body: { name, slug: slugFor(name) }, headers: fromNodeHeaders(headers) });
  const membership = await findMembershipForUser(teacher.user.id);
  if (!membership) throw new HttpError(500, "server_error", "The department was not created.");
  return { id: membership.departmentId, name: membership.departmentName, role: membership.role };
}

function requireDepartment(teacher: TeacherContext) {
  if (!teacher.department) throw new HttpError(403, "no_department", "Join or create a department first.");
  return teacher.department;
}

export async function membersOfDepartment(teacher: TeacherContext) {
  return listDepartmentMembers(requireDepartment(teacher).id);
}

export async function renameTeacherDepartment(teacher: TeacherContext, name: string) {
  return renameDepartment(requireDepartment(teacher).id, name);
}
