import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link } from "react-router-dom";
import {
  invitationStateLabels,
  joinSignInSchema,
  joinSignUpSchema,
  type InvitationPreview,
  type JoinSignInInput,
  type JoinSignUpInput,
} from "@shared/schemas/invitations";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useJoinDepartment } from "../api/accept-invitation";
import { useInvitationPreview } from "../api/get-invitation-preview";
import { invitationDate } from "./invitation-dates";

type SignedIn = { email: string; name: string } | null;

type Join = ReturnType<typeof useJoinDepartment>;

function NewAccountForm({ preview, join, onJoined }: { preview: InvitationPreview; join: Join; onJoined: () => void }) {
  const { register, handleSubmit, formState } = useForm<JoinSignUpInput>({ resolver: zodResolver(joinSignUpSchema) });
  const submit = handleSubmit((values) =>
    join.mutate({ kind: "sign-up", invitationId: preview.id, email: preview.email, values }, { onSuccess: onJoined }),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Create your account and join" className="flex flex-col gap-4">
      {join.error && (
        <Alert tone="error" title="Not joined yet">
          {join.error.message}
        </Alert>
      )}
      <TextField label="E-mail" type="email" value={preview.email} readOnly hint="The invitation is for this address." />
      <TextField label="Your name" autoComplete="name" {...register("name")} error={formState.errors.name?.message} />
      <TextField
        label="Choose a password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters and hard to guess: three or four unrelated words work well."
        {...register("password")}
        error={formState.errors.password?.message}
      />
      <Button type="submit" busy={join.isPending}>
        Create account and join
      </Button>
    </form>
  );
}

function ExistingAccountForm({ preview, join, onJoined }: { preview: InvitationPreview; join: Join; onJoined: () => void }) {
  const { register, handleSubmit, formState } = useForm<JoinSignInInput>({ resolver: zodResolver(joinSignInSchema) });
  const submit = handleSubmit((values) =>
    join.mutate({ kind: "sign-in", invitationId: preview.id, email: preview.email, values }, { onSuccess: onJoined }),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Sign in and join" className="flex flex-col gap-4">
      {join.error && (
        <Alert tone="error" title="Not joined yet">
          {join.error.message}
        </Alert>
      )}
      <p>You already have an Outroll account with this address. Sign in to join.</p>
      <TextField label="E-mail" type="email" value={preview.email} readOnly />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        {...register("password")}
        error={formState.errors.password?.message}
      />
      <Button type="submit" busy={join.isPending}>
        Sign in and join
      </Button>
      <Link to="/forgot-password" className="font-bold text-tide underline">
        Forgot your password?
      </Link>
    </form>
  );
}

/** The page an invitation e-mail's link opens: who invites whom to which department, then the one step to join. */
export function JoinInvitation({
  invitationId,
  signedIn,
  onSignOut,
  signingOut,
  onJoined,
}: {
  invitationId: string;
  signedIn: SignedIn;
  onSignOut: () => void;
  signingOut: boolean;
  onJoined: () => void;
}) {
  const preview = useInvitationPreview(invitationId);
  // Owned here, not by the forms: signing up changes who is signed in, which swaps the forms out mid-join.
  const join = useJoinDepartment();
  if (preview.isPending) return <p role="status">Opening the invitation…</p>;
  if (preview.isError) {
    return (
      <Alert tone="error" title="This invitation cannot be opened">
        {preview.error.message}
      </Alert>
    );
  }
  const invitation = preview.data;
  const intro = (
    <div className="mb-6 flex flex-col gap-2">
      <p className="text-lg">
        <span className="font-bold">{invitation.inviterName}</span> invites you to join{" "}
        <span className="font-bold">{invitation.departmentName}</span> on Outroll as a teacher.
      </p>
      <p className="text-ink-soft">
        For {invitation.email} ·{" "}
        {invitation.state === "pending"
          ? `works once, until ${invitationDate(invitation.expiresAt)}`
          : invitationStateLabels[invitation.state]}
      </p>
    </div>
  );

  if (invitation.state !== "pending") {
    const why = {
      expired: "This invitation has expired. Ask your head of department to send it again; the new e-mail has a fresh link.",
      accepted: "This invitation has already been used. If it was you, sign in.",
      canceled: "This invitation was cancelled by the head of department.",
      rejected: "This invitation was declined.",
    }[invitation.state];
    return (
      <>
        {intro}
        <Alert tone="caution" title={invitationStateLabels[invitation.state]}>
          {why}
        </Alert>
        <p className="mt-4">
          <Link to="/sign-in" className="font-bold text-tide underline">
            Go to sign-in
          </Link>
        </p>
      </>
    );
  }

  if (join.isPending || join.isSuccess) {
    return (
      <>
        {intro}
        <p role="status" className="text-lg font-bold">
          Joining {invitation.departmentName}…
        </p>
      </>
    );
  }

  if (signedIn) {
    const same = signedIn.email.toLowerCase() === invitation.email.toLowerCase();
    return (
      <>
        {intro}
        {same ? (
          <div className="flex flex-col gap-4">
            {join.error && (
              <Alert tone="error" title="Not joined">
                {join.error.message}
              </Alert>
            )}
            <p>You are signed in as {signedIn.name}.</p>
            <Button busy={join.isPending} onClick={() => join.mutate({ kind: "signed-in", invitationId }, { onSuccess: onJoined })}>
              Join {invitation.departmentName}
            </Button>
          </div>
        ) : (
          <div className="flex flex-col gap-4">
            <Alert tone="caution" title="Signed in with another address">
              You are signed in as {signedIn.email}, but this invitation is for {invitation.email}. Sign out, then open the link again.
            </Alert>
            <Button variant="secondary" busy={signingOut} onClick={onSignOut}>
              Sign out
            </Button>
          </div>
        )}
      </>
    );
  }

  return (
    <>
      {intro}
      {invitation.hasAccount ? (
        <ExistingAccountForm preview={invitation} join={join} onJoined={onJoined} />
      ) : (
        <NewAccountForm preview={invitation} join={join} onJoined={onJoined} />
      )}
      <p className="mt-6 text-sm text-ink-soft">
        Pupils never have accounts. Please do not type pupils&rsquo; names into lesson notes or uploads.
      </p>
    </>
  );
}
