import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link } from "react-router-dom";
import { passwordResetSchema, type PasswordResetInput } from "@shared/schemas/password-reset";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { ApiRequestError } from "@/lib/api-client";
import { useResetPassword } from "../api/reset-password";

/** The page behind the e-mailed link: the new password, typed twice. */
export function ResetPasswordForm({ token }: { token: string }) {
  const reset = useResetPassword();
  const { register, handleSubmit, formState } = useForm<PasswordResetInput>({ resolver: zodResolver(passwordResetSchema) });
  if (reset.isSuccess) {
    return (
      <Alert tone="info" title="Password changed">
        <p>Your new password is set, and any other signed-in browsers were signed out.</p>
        <p className="mt-2">
          <Link to="/sign-in" className="font-bold text-tide underline">
            Sign in with your new password
          </Link>
        </p>
      </Alert>
    );
  }
  // better-auth answers an unknown, used or expired token with 400.
  const linkSpent = reset.error instanceof ApiRequestError && reset.error.status === 400;
  return (
    <form
      onSubmit={handleSubmit((values) => reset.mutate({ token, newPassword: values.newPassword }))}
      noValidate
      aria-label="Choose a new password"
      className="flex flex-col gap-4"
    >
      {reset.error && (
        <Alert tone="error" title="Password not changed">
          {linkSpent ? (
            <>
              This link has expired or was already used.{" "}
              <Link to="/forgot-password" className="font-bold underline">
                Ask for a new link
              </Link>
              .
            </>
          ) : (
            reset.error.message
          )}
        </Alert>
      )}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters and hard to guess: three or four unrelated words work well."
        {...register("newPassword")}
        error={formState.errors.newPassword?.message}
      />
      <TextField
        label="New password again"
        type="password"
        autoComplete="new-password"
        {...register("confirmPassword")}
        error={formState.errors.confirmPassword?.message}
      />
      <Button type="submit" busy={reset.isPending}>
        Set the new password
      </Button>
    </form>
  );
}
