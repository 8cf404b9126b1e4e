import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signInSchema, type SignInInput } from "@shared/schemas/account";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useSignIn } from "../api/sign-in";

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });
  const submit = handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }));
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
      {signIn.error && (
        <Alert tone="error" title="Not signed in">
          {signIn.error.message}
        </Alert>
      )}
      <TextField label="E-mail" type="email" autoComplete="email" {...register("email")} error={formState.errors.email?.message} />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        {...register("password")}
        error={formState.errors.password?.message}
      />
      <Button type="submit" busy={signIn.isPending}>
        Sign in
      </Button>
    </form>
  );
}
