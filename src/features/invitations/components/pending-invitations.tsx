import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { useCancelInvitation } from "../api/cancel-invitation";
import { useInvitations } from "../api/list-invitations";
import { useResendInvitation } from "../api/resend-invitation";
import { invitationDate, timeLeft } from "./invitation-dates";

/** The head's list of invitations waiting to be used, with when each expires and Resend / Cancel. */
export function PendingInvitations() {
  const invitations = useInvitations(true);
  const resend = useResendInvitation();
  const cancel = useCancelInvitation();
  if (invitations.isPending) return <p role="status">Loading invitations…</p>;
  if (invitations.isError) {
    return (
      <Alert tone="error" title="Invitations could not be loaded">
        {invitations.error.message}
      </Alert>
    );
  }
  const rows = invitations.data.invitations;
  return (
    <div className="flex flex-col gap-3">
      {(resend.error || cancel.error) && (
        <Alert tone="error" title="Not done">
          {(resend.error ?? cancel.error)?.message}
        </Alert>
      )}
      {resend.data && (
        <p role="status" className="font-bold text-tide-dark">
          Sent again to {resend.data.invitation.email}.
        </p>
      )}
      {rows.length === 0 ? (
        <p className="text-ink-soft">No invitations are waiting.</p>
      ) : (
        <ul className="flex flex-col gap-3" aria-label="Invitations waiting">
          {rows.map((row) => {
            const expired = row.state === "expired";
            return (
              <li
                key={row.id}
                className="flex flex-wrap items-center justify-between gap-3 rounded-xl border-2 border-line bg-white px-4 py-3"
              >
                <div className="min-w-0">
                  <p className="break-all font-bold">{row.email}</p>
                  <p className="text-sm text-ink-soft">
                    Sent {invitationDate(row.createdAt)} by {row.inviterName} ·{" "}
                    {expired ? (
                      <span className="font-bold text-alarm">✗ Expired {invitationDate(row.expiresAt)}</span>
                    ) : (
                      <span>
                        Expires {timeLeft(row.expiresAt)} ({invitationDate(row.expiresAt)})
                      </span>
                    )}
                  </p>
                </div>
                <div className="flex flex-wrap gap-2">
                  <Button
                    variant="secondary"
                    busy={resend.isPending && resend.variables === row.id}
                    onClick={() => resend.mutate(row.id)}
                    aria-label={`Resend the invitation to ${row.email}`}
                  >
                    Resend
                  </Button>
                  <Button
                    variant="quiet"
                    busy={cancel.isPending && cancel.variables === row.id}
                    onClick={() => cancel.mutate(row.id)}
                    aria-label={`Cancel the invitation to ${row.email}`}
                  >
                    Cancel
                  </Button>
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
