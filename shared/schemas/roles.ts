import { z } from "zod";

/** A member's role in a department. */
export const departmentRoleSchema = z.enum(["head", "teacher"]);
export type DepartmentRole = z.infer<typeof departmentRoleSchema>;

export const departmentRoleLabels: Record<DepartmentRole, string> = {
  head: "Head of department",
  teacher: "Teacher",
};
