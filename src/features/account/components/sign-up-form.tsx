import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signUpSchema, type SignUpInput } from "@shared/schemas/account";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useSignUp } from "../api/sign-up";

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signUp = useSignUp();
  const { register, handleSubmit, formState } = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema) });
  const submit = handleSubmit((values) => signUp.mutate(values, { onSuccess: onSignedUp }));
  const errors = formState.errors;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Create your account">
      {signUp.error && (
        <Alert tone="error" title="Account not created">
          {signUp.error.message}
        </Alert>
      )}
      <TextField label="Your name" autoComplete="name" {...register("name")} error={errors.name?.message} />
      <TextField label="School e-mail" type="email" autoComplete="email" {...register("email")} error={errors.email?.message} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters and hard to guess: three or four unrelated words work well."
        {...register("password")}
        error={errors.password?.message}
      />
      <TextField
        label="Your department"
        hint="You become its head of department and can invite colleagues."
        placeholder="Maths, Harbourside Academy"
        {...register("departmentName")}
        error={errors.departmentName?.message}
      />
      <Button type="submit" busy={signUp.isPending}>
        Create account
      </Button>
    </form>
  );
}
