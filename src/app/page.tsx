import Link from "next/link";
import { Caution } from "@/components/caution";
import { SoaSketch } from "@/components/soa-sketch";
import { VerdictBadge } from "@/components/verdict-shape";

const steps = [
  {
    title: "Library",
    text: "Enter a transistor's ratings, upload its SOA figure digitised from the datasheet as CSV, add its Foster thermal model. Digitising mistakes show up as findings on the chart.",
  },
  {
    title: "Projects and fault cases",
    text: "Describe the design under review: case temperature, margin policy, candidate parts, and the pulses it must survive: inrush, short circuit until the protection trips, overload trains.",
  },
  {
    title: "Bench evidence",
    text: "Technicians paste measured pulses or upload scope captures. The server computes power, energy and the junction-temperature trace, and answers at once.",
  },
  {
    title: "Check, compare, decide",
    text: "Every pulse against every candidate, derated for temperature and repetition, plotted on log-log limit lines. The lead signs a decision that is frozen for audit.",
  },
];

export default function HomePage() {
  return (
    <div className="mx-auto flex min-h-screen max-w-6xl flex-col px-6">
      <header className="flex items-center justify-between border-b border-line py-4">
        <span className="text-base font-semibold tracking-tight">
          Pulse<span className="text-accent">fence</span>
        </span>
        <Link
          href="/sign-in"
          className="rounded-md bg-accent px-4 py-1.5 text-sm font-medium text-white hover:bg-accent-strong"
        >
          Sign in
        </Link>
      </header>

      <main className="flex-1">
        <section className="grid items-center gap-10 py-14 md:grid-cols-[1.1fr_1fr]">
          <div>
            <p className="mb-3 font-mono text-xs uppercase tracking-widest text-ink-muted">
              Safe operating area review for power transistors
            </p>
            <h1 className="text-4xl font-semibold leading-tight tracking-tight text-ink">
              Every stress pulse, checked against the limits the datasheet draws.
            </h1>
            <p className="mt-5 max-w-xl text-base leading-relaxed text-ink-muted">
              Pulsefence answers one question before hardware is built or shipped: does every pulse this
              MOSFET, SiC MOSFET, GaN HEMT or IGBT will see stay inside its SOA, with margin, at the
              temperature it will really run at? Log-log interpolation, temperature and repetition derating,
              and the junction temperature from its Foster network, computed on the server and explained
              number by number.
            </p>
            <div className="mt-7 flex flex-wrap items-center gap-4 text-sm">
              <VerdictBadge verdict="pass" />
              <VerdictBadge verdict="marginal" />
              <VerdictBadge verdict="fail" />
              <VerdictBadge verdict="no-data" />
            </div>
          </div>
          <figure className="rounded-lg border border-line bg-panel p-4">
            <SoaSketch />
            <figcaption className="mt-2 text-xs text-ink-muted">
              Limit lines of an invented part at 25&nbsp;°C case; three pulses and their verdicts.
            </figcaption>
          </figure>
        </section>

        <section aria-labelledby="job" className="border-t border-line py-12">
          <h2 id="job" className="text-lg font-semibold">
            The whole job, in one place your team can review
          </h2>
          <ol className="mt-6 grid gap-6 md:grid-cols-4">
            {steps.map((step, k) => (
              <li key={step.title} className="rounded-lg border border-line bg-panel p-4">
                <span className="num font-mono text-xs text-ink-faint">{String(k + 1).padStart(2, "0")}</span>
                <h3 className="mt-1 font-medium">{step.title}</h3>
                <p className="mt-2 text-sm leading-relaxed text-ink-muted">{step.text}</p>
              </li>
            ))}
          </ol>
        </section>

        <section aria-labelledby="roles" className="border-t border-line py-12">
          <h2 id="roles" className="text-lg font-semibold">
            Built for the people who sign off
          </h2>
          <dl className="mt-6 grid gap-x-8 gap-y-4 text-sm md:grid-cols-2">
            <div>
              <dt className="font-medium">Engineers</dt>
              <dd className="text-ink-muted">
                build the part library, define projects and fault cases, run checks.
              </dd>
            </div>
            <div>
              <dt className="font-medium">Technicians</dt>
              <dd className="text-ink-muted">
                log what the bench measured and see at once whether it passes.
              </dd>
            </div>
            <div>
              <dt className="font-medium">Leads</dt>
              <dd className="text-ink-muted">
                compare candidates across every fault case and sign the decision.
              </dd>
            </div>
            <div>
              <dt className="font-medium">Admins</dt>
              <dd className="text-ink-muted">
                own the workspace: members and roles. Each team sees only its own data.
              </dd>
            </div>
          </dl>
        </section>
      </main>

      <footer className="border-t border-line py-6">
        <Caution />
      </footer>
    </div>
  );
}
