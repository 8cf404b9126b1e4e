import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { SignInForm } from "@/features/account/components/sign-in-form";
import { AccountPage } from "./account-page";

/** Only same-site paths are followed after sign-in, never another origin. */
function safeNext(next: string | null) {
  return next && next.startsWith("/") && !next.startsWith("//") ? next : "/app";
}

export function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <AccountPage
      title="Sign in"
      footer={
        <>
          New to Outroll?{" "}
          <Link className="font-bold text-tide underline" to="/sign-up">
            Create an account
          </Link>
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(safeNext(params.get("next")), { replace: true })} />
      <p className="mt-4">
        <Link className="font-bold text-tide underline" to="/forgot-password">
          Forgot your password?
        </Link>
      </p>
    </AccountPage>
  );
}
