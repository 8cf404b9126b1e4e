import type { ComponentProps } from "react";

const variants = {
  primary: "bg-tide text-white hover:bg-tide-dark shadow-sm",
  secondary: "bg-shell text-ink border-2 border-ink/20 hover:border-ink/50",
  quiet: "text-ink hover:bg-ink/5",
  danger: "bg-alarm text-white hover:bg-alarm/90",
} as const;

type ButtonProps = ComponentProps<"button"> & { variant?: keyof typeof variants; busy?: boolean };

export function Button({ variant = "primary", busy = false, className = "", children, disabled, ...props }: ButtonProps) {
  return (
    <button
      {...props}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-xl px-4 py-2 text-base font-bold transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${variants[variant]} ${className}`}
    >
      {children}
    </button>
  );
}
