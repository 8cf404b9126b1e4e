import { Link } from "react-router-dom";
import { RequestResetForm } from "@/features/password-reset/components/request-reset-form";
import { AccountPage } from "./account-page";

export function ForgotPasswordRoute() {
  return (
    <AccountPage
      title="Forgot your password?"
      footer={
        <>
          Remembered it?{" "}
          <Link className="font-bold text-tide underline" to="/sign-in">
            Sign in
          </Link>
        </>
      }
    >
      <RequestResetForm />
    </AccountPage>
  );
}
