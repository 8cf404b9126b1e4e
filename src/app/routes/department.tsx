import { Link } from "react-router-dom";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useWaitingProposals } from "@/features/department-shelf/api/get-waiting-proposals";
import { ColleaguesPanel } from "@/features/invitations/components/colleagues-panel";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";

/** For the head: the shelf's queue at a glance, beside the people. */
function ShelfQueueNote() {
  const waiting = useWaitingProposals(true);
  const count = waiting.data?.waiting;
  if (count === undefined) return null;
  return (
    <p className="mb-6 max-w-3xl rounded-xl bg-shell px-4 py-3">
      <span className="font-bold">Department shelf: </span>
      {count === 0 ? "no proposals are waiting." : `${count === 1 ? "1 proposal waits" : `${count} proposals wait`} for your decision. `}
      {count > 0 && (
        <Link to="/app/shelf/proposals" className="font-bold text-tide underline">
          Go to the proposals
        </Link>
      )}
    </p>
  );
}

/** The Department page: the department's colleagues for every member; invitations for the head of department. */
export function DepartmentRoute() {
  const teacher = useCurrentTeacher();
  const department = teacher.data?.department ?? null;
  const isHead = teacher.data?.role === "head";
  if (!department) {
    return (
      <>
        <PageHeader title="Department" />
        <Alert tone="info" title="Join a department first">
          Your head of department invites you by e-mail; the link in it joins you to the department.
        </Alert>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title={department.name}
        lead={
          isHead
            ? "Invite colleagues to join your department, follow their invitations, and see who is in it."
            : "The colleagues in your department. Your head of department invites new ones."
        }
      />
      {isHead && <ShelfQueueNote />}
      <ColleaguesPanel isHead={isHead} />
    </>
  );
}
