import { useNavigate, useSearchParams } from "react-router-dom";
import { joinQuerySchema } from "@shared/schemas/invitations";
import { useCurrentTeacher } from "@/features/account/api/get-current-teacher";
import { useSignOut } from "@/features/account/api/sign-out";
import { JoinInvitation } from "@/features/invitations/components/join-invitation";
import { Alert } from "@/components/ui/alert";
import { AccountPage } from "./account-page";

/** /join?invitation=<id>: the page an invitation e-mail links to. */
export function JoinRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const teacher = useCurrentTeacher();
  const signOut = useSignOut();
  const query = joinQuerySchema.safeParse({ invitation: params.get("invitation") ?? "" });
  return (
    <AccountPage title="Join your department" footer={<>Outroll is for maths departments teaching probability with intransitive dice.</>}>
      {!query.success ? (
        <Alert tone="error" title="This link is incomplete">
          The address has no invitation in it. Open the link from the invitation e-mail again, or copy the whole address.
        </Alert>
      ) : teacher.isPending ? (
        <p role="status">Checking whether you are signed in…</p>
      ) : (
        <JoinInvitation
          invitationId={query.data.invitation}
          signedIn={teacher.data ? { email: teacher.data.user.email, name: teacher.data.user.name } : null}
          signingOut={signOut.isPending}
          onSignOut={() => signOut.mutate()}
          onJoined={() => navigate("/app/shelf", { replace: true })}
        />
      )}
    </AccountPage>
  );
}
