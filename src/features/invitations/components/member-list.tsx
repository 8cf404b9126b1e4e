import { departmentRoleLabels } from "@shared/schemas/roles";
import { Alert } from "@/components/ui/alert";
import { useDepartmentMembers } from "../api/list-department-members";

/** Everyone in the department with their role. */
export function MemberList() {
  const members = useDepartmentMembers();
  if (members.isPending) return <p role="status">Loading colleagues…</p>;
  if (members.isError) {
    return (
      <Alert tone="error" title="Colleagues could not be loaded">
        {members.error.message}
      </Alert>
    );
  }
  return (
    <ul className="grid gap-3 sm:grid-cols-2" aria-label="Department members">
      {members.data.members.map((member) => (
        <li key={member.userId} className="rounded-xl border-2 border-line bg-white px-4 py-3">
          <p className="font-bold">{member.name}</p>
          <p className="break-all text-sm text-ink-soft">{member.email}</p>
          <p className="mt-1 text-sm font-bold">{departmentRoleLabels[member.role]}</p>
        </li>
      ))}
    </ul>
  );
}
