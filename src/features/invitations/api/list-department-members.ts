import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DepartmentRole } from "@shared/schemas/roles";
import { api } from "@/lib/api-client";

export type DepartmentMember = { userId: string; name: string; email: string; role: DepartmentRole; joinedAt: string };

/** Everyone in the teacher's department with their role. */
export function listDepartmentMembers() {
  return api.get<{ members: DepartmentMember[] }>("/api/departments/current/members");
}

export const departmentMembersQueryOptions = queryOptions({
  queryKey: ["departments", "current", "members"],
  queryFn: listDepartmentMembers,
});

export function useDepartmentMembers() {
  return useQuery(departmentMembersQueryOptions);
}
