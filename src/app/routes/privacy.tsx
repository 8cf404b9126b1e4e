import { Link } from "react-router-dom";
import { PrivacyNotice } from "@/features/privacy/components/privacy-notice";
import { Logo } from "@/components/ui/logo";

/** The privacy notice, public: a pupil, a parent or a teacher can read it without signing in. */
export function PrivacyRoute() {
  return (
    <div className="min-h-dvh">
      <header className="bg-ink text-sand">
        <div className="mx-auto flex max-w-4xl items-center justify-between gap-4 px-4 py-4 sm:px-8">
          <Link to="/" className="flex items-center gap-2 text-xl font-bold">
            <Logo className="h-8 w-8 text-tide" />
            Outroll
          </Link>
          <Link to="/app" className="rounded-xl px-3 py-2 font-bold hover:bg-white/10">
            Teachers&rsquo; pages
          </Link>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-4xl px-4 py-8 sm:px-8">
        <h1 className="text-3xl sm:text-4xl">Privacy notice</h1>
        <p className="mb-6 mt-2 max-w-3xl text-lg text-ink-soft">
          What Outroll keeps about pupils and teachers, for how long, who can see it, and how to have it deleted.
        </p>
        <PrivacyNotice />
      </main>
    </div>
  );
}
