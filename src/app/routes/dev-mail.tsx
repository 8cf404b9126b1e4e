import { Link } from "react-router-dom";
import { ReceivedMailPage } from "@/features/dev-mail/components/received-mail";
import { Logo } from "@/components/ui/logo";

/** /dev/mail: development only, the local fake mail server's messages so e-mail flows can be followed by hand. */
export function DevMailRoute() {
  return (
    <div className="min-h-dvh bg-sand">
      <header className="bg-ink text-sand">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-3 sm:px-6">
          <Link to="/" className="flex items-center gap-2 text-xl font-bold">
            <Logo className="h-8 w-8 text-tide" />
            Outroll
          </Link>
          <p className="rounded-lg border-2 border-amber-300 px-2 py-1 text-sm font-bold text-amber-200">Development only</p>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-4 py-6 sm:px-6">
        <h1 className="text-3xl sm:text-4xl">Local mailbox</h1>
        <p className="mb-6 mt-2 max-w-3xl text-lg text-ink-soft">
          Every e-mail Outroll sent while no SMTP_URL is set lands in its own fake mail server on this machine, not in anyone&rsquo;s inbox.
          Newest first; refreshes by itself.
        </p>
        <ReceivedMailPage />
      </main>
    </div>
  );
}
