import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { inviteTeacherSchema, type InviteTeacherInput } from "@shared/schemas/invitations";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useInviteTeacher } from "../api/invite-teacher";

/** The head of department invites a colleague by school e-mail address. */
export function InviteForm() {
  const invite = useInviteTeacher();
  const { register, handleSubmit, formState, reset } = useForm<InviteTeacherInput>({
    resolver: zodResolver(inviteTeacherSchema),
    defaultValues: { email: "" },
  });
  const submit = handleSubmit((values) => invite.mutate(values, { onSuccess: () => reset({ email: "" }) }));
  return (
    <form onSubmit={submit} noValidate aria-label="Invite a colleague" className="flex flex-col gap-4">
      {invite.error && (
        <Alert tone="error" title="Invitation not sent">
          {invite.error.message}
        </Alert>
      )}
      {invite.data && (
        <Alert tone="info" title="Invitation sent">
          {invite.data.invitation.email} has an e-mail with a link to join as a teacher. The link works once, for 7 days.
        </Alert>
      )}
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="Colleague's school e-mail"
          type="email"
          autoComplete="off"
          className="min-w-0 flex-1 basis-64"
          placeholder="name@school.test"
          {...register("email")}
          error={formState.errors.email?.message}
        />
        <Button type="submit" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
