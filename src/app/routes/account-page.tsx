import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import { Logo } from "@/components/ui/logo";

/** The frame around the sign-in and sign-up forms, with the privacy notice linked below. */
export function AccountPage({ title, children, footer }: { title: string; children: ReactNode; footer: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center bg-sand px-4 py-10">
      <header className="mb-6">
        <Link to="/" className="flex items-center gap-3 text-2xl font-bold text-ink">
          <Logo className="h-10 w-10 text-ink" />
          Outroll
        </Link>
      </header>
      <main className="w-full max-w-md rounded-2xl border-2 border-line bg-shell p-6 shadow-sm sm:p-8">
        <h1 className="mb-6 text-3xl">{title}</h1>
        {children}
        <div className="mt-6 border-t-2 border-line pt-4 text-ink-soft">{footer}</div>
      </main>
      {/* Sign-up and joining collect a teacher's name and address: what happens to them is one tap away. */}
      <footer className="mt-6 text-sm">
        <Link to="/privacy" className="font-bold text-tide underline">
          Privacy notice
        </Link>
      </footer>
    </div>
  );
}
