import { Link, useSearchParams } from "react-router-dom";
import { passwordResetQuerySchema } from "@shared/schemas/password-reset";
import { ResetPasswordForm } from "@/features/password-reset/components/reset-password-form";
import { Alert } from "@/components/ui/alert";
import { AccountPage } from "./account-page";

/** /reset-password?token=…: the page the password-reset e-mail links to. */
export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const query = passwordResetQuerySchema.safeParse({ token: params.get("token") ?? "" });
  return (
    <AccountPage
      title="Choose a new password"
      footer={
        <Link className="font-bold text-tide underline" to="/sign-in">
          Back to sign-in
        </Link>
      }
    >
      {query.success ? (
        <ResetPasswordForm token={query.data.token} />
      ) : (
        <Alert tone="error" title="This link is incomplete">
          Open the link from the e-mail again, or{" "}
          <Link to="/forgot-password" className="font-bold underline">
            ask for a new one
          </Link>
          .
        </Alert>
      )}
    </AccountPage>
  );
}
