import type { AnchorHTMLAttributes } from "react";
import { Link, type LinkProps } from "react-router-dom";

const variants = {
  primary: "bg-tide text-white hover:bg-tide-dark shadow-sm",
  secondary: "bg-shell text-ink border-2 border-ink/20 hover:border-ink/50",
  quiet: "text-ink hover:bg-ink/5",
} as const;

const base = "inline-flex min-h-11 items-center justify-center gap-2 rounded-xl px-4 py-2 text-base font-bold transition-colors";

/** A link that looks like a button, for actions that move to another page. */
export function LinkButton({ variant = "secondary", className = "", ...props }: LinkProps & { variant?: keyof typeof variants }) {
  return <Link {...props} className={`${base} ${variants[variant]} ${className}`} />;
}

/** A plain anchor styled like a button, for downloads the server answers. */
export function AnchorButton({
  variant = "secondary",
  className = "",
  children,
  ...props
}: AnchorHTMLAttributes<HTMLAnchorElement> & { variant?: keyof typeof variants }) {
  return (
    <a {...props} className={`${base} ${variants[variant]} ${className}`}>
      {children}
    </a>
  );
}
