import { InviteForm } from "./invite-form";
import { MemberList } from "./member-list";
import { PendingInvitations } from "./pending-invitations";

/** The department's people: every member sees the list; the head of department also invites and manages invitations. */
export function ColleaguesPanel({ isHead }: { isHead: boolean }) {
  return (
    <div className="flex flex-col gap-8">
      {isHead && (
        <section aria-labelledby="invite-heading" className="max-w-3xl rounded-2xl border-2 border-line bg-shell p-5">
          <h2 id="invite-heading" className="text-2xl">
            Invite a colleague
          </h2>
          <p className="mb-4 mt-1 text-ink-soft">
            They get an e-mail with a sign-up link that joins your department as a teacher. It works once and expires after 7 days.
          </p>
          <InviteForm />
          <h3 className="mb-3 mt-6 text-xl">Invitations waiting</h3>
          <PendingInvitations />
        </section>
      )}
      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="mb-3 text-2xl">
          Colleagues in the department
        </h2>
        <MemberList />
      </section>
    </div>
  );
}
