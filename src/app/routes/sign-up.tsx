import { Link, useNavigate } from "react-router-dom";
import { SignUpForm } from "@/features/account/components/sign-up-form";
import { AccountPage } from "./account-page";

export function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <AccountPage
      title="Create your account"
      footer={
        <>
          Already have one?{" "}
          <Link className="font-bold text-tide underline" to="/sign-in">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate("/app", { replace: true })} />
    </AccountPage>
  );
}
