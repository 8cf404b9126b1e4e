import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { PASSWORD_RESET_MINUTES, passwordResetRequestSchema, type PasswordResetRequestInput } from "@shared/schemas/password-reset";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useRequestPasswordReset } from "../api/request-password-reset";

/** "Forgot your password?": the teacher's address, then a link by e-mail. */
export function RequestResetForm() {
  const request = useRequestPasswordReset();
  const { register, handleSubmit, formState, getValues } = useForm<PasswordResetRequestInput>({
    resolver: zodResolver(passwordResetRequestSchema),
  });
  if (request.isSuccess) {
    return (
      <Alert tone="info" title="Check your e-mail">
        If {getValues("email")} has an Outroll account, an e-mail with a link to choose a new password is on its way. The link works once,
        for {PASSWORD_RESET_MINUTES} minutes.
      </Alert>
    );
  }
  return (
    <form
      onSubmit={handleSubmit((values) => request.mutate(values))}
      noValidate
      aria-label="Ask for a reset link"
      className="flex flex-col gap-4"
    >
      {request.error && (
        <Alert tone="error" title="No link sent">
          {request.error.message}
        </Alert>
      )}
      <p>Enter the e-mail address you sign in with. We will send a link to choose a new password.</p>
      <TextField label="E-mail" type="email" autoComplete="email" {...register("email")} error={formState.errors.email?.message} />
      <Button type="submit" busy={request.isPending}>
        Send the link
      </Button>
    </form>
  );
}
