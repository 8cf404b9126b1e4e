import { Link } from "react-router-dom";

export function NotFoundRoute({ inShell = false }: { inShell?: boolean }) {
  return (
    <main className={`flex flex-col items-start gap-4 ${inShell ? "" : "min-h-dvh bg-sand p-8"}`}>
      <p className="text-6xl font-bold text-beacon" aria-hidden="true">
        404
      </p>
      <h1 className="text-3xl">This page is not here</h1>
      <p className="text-lg text-ink-soft">The address may be mistyped, or the page may have moved.</p>
      <Link to={inShell ? "/app" : "/"} className="rounded-xl bg-tide px-4 py-2 font-bold text-white">
        {inShell ? "Back to your overview" : "Go to the start page"}
      </Link>
    </main>
  );
}
