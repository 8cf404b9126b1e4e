import { Link } from "react-router-dom";
import { Logo } from "@/components/ui/logo";

const steps = [
  { name: "Guess", text: "Pupils predict the best die. Most pick the one with the biggest faces." },
  { name: "Roll", text: "Groups play their matchups and tap every roll into a phone, or onto a paper sheet." },
  { name: "Pool", text: "The whole class's rolls come together live, beside the exact probabilities." },
  { name: "Prove", text: "A tree diagram shows why each die is beaten by another: there is no best die." },
  { name: "Twist", text: "Two dice each, or a third player, and the cycle can turn round." },
  { name: "Reflect", text: "Talk it through and finish with an exit ticket." },
];

export function LandingRoute() {
  return (
    <div className="min-h-dvh bg-ink text-sand">
      <header className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-4 px-4 py-5 sm:px-8">
        <Link to="/" className="flex items-center gap-3 text-2xl font-bold text-sand">
          <Logo className="h-10 w-10 text-tide" />
          Outroll
        </Link>
        <div className="flex flex-wrap items-center justify-end gap-2">
          {/* A full page load: the Roll pad is a page of its own, not part of the teachers' app. */}
          <a
            href="/pad"
            className="whitespace-nowrap rounded-xl border-2 border-amber-300 px-4 py-2 font-bold text-amber-200 hover:bg-white/10"
          >
            Join a class
          </a>
          <nav aria-label="Account" className="flex gap-2">
            <Link to="/sign-in" className="whitespace-nowrap rounded-xl px-4 py-2 font-bold text-sand hover:bg-white/10">
              Sign in
            </Link>
            <Link to="/sign-up" className="whitespace-nowrap rounded-xl bg-sand px-4 py-2 font-bold text-ink hover:bg-white">
              Create account
            </Link>
          </nav>
        </div>
      </header>
      <main>
        <section className="mx-auto max-w-6xl px-4 pb-14 pt-8 sm:px-8 sm:pt-16">
          <p className="mb-3 font-bold uppercase tracking-widest text-amber-300">For maths teachers</p>
          <h1 className="max-w-4xl text-4xl leading-tight sm:text-6xl">
            Dice that beat each other in a circle, and a lesson that proves why.
          </h1>
          <p className="mt-6 max-w-2xl text-xl text-sand/85">
            Outroll helps you choose or design an intransitive dice set, plan the lesson, run it live with pupils&rsquo; phones or paper,
            pool the class&rsquo;s rolls against the exact probabilities, and share the lesson with your department.
          </p>
          <div className="mt-8 flex flex-wrap gap-3">
            <Link to="/sign-up" className="rounded-xl bg-amber-400 px-5 py-3 text-lg font-bold text-ink hover:bg-amber-300">
              Start planning a lesson
            </Link>
            <Link to="/sign-in" className="rounded-xl border-2 border-sand/40 px-5 py-3 text-lg font-bold hover:border-sand">
              I have an account
            </Link>
          </div>
        </section>
        <section aria-labelledby="how-heading" className="bg-sand text-ink">
          <div className="mx-auto max-w-6xl px-4 py-12 sm:px-8">
            <h2 id="how-heading" className="text-3xl">
              One lesson, six phases
            </h2>
            <ol className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
              {steps.map((step, index) => (
                <li key={step.name} className="rounded-2xl border-2 border-line bg-shell p-5">
                  <p className="text-sm font-bold text-tide">Phase {index + 1}</p>
                  <h3 className="text-2xl">{step.name}</h3>
                  <p className="mt-2 text-ink-soft">{step.text}</p>
                </li>
              ))}
            </ol>
            <p className="mt-8 max-w-3xl text-ink-soft">
              Pupils never make accounts. Groups join a class run with a join code or QR code and choose a nickname; Outroll stores only
              those nicknames and the rolls.
            </p>
          </div>
        </section>
      </main>
      <footer className="mx-auto max-w-6xl px-4 py-6 sm:px-8">
        <Link to="/privacy" className="font-bold text-sand underline">
          Privacy notice
        </Link>
      </footer>
    </div>
  );
}
