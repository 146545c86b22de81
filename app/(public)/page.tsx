import Link from '@/components/link';
import { SafetyNote } from '@/components/safety-note';

const STEPS = [
  {
    title: 'Rules fixed before anyone measures',
    text: 'Organisers set each class’s nozzle limits, power band, minimum weight, safety items and the decision rule, and publish them as a numbered version.',
  },
  {
    title: 'Entries with their declarations',
    text: 'Entrants register boats with pump, nozzle and engine declared, see how they sit against the class rules, enter and pay.',
  },
  {
    title: 'Measured at the dock, decided on the server',
    text: 'Scrutineers scan the boat’s tag on a phone, record two-point readings with the instrument used, and get a verdict that accounts for measurement uncertainty — offline too.',
  },
  {
    title: 'Protests heard on evidence',
    text: 'Stewards see every record, photo and hash; decisions, fees and refunds are kept in an audit trail.',
  },
  {
    title: 'Parity you can publish',
    text: 'Each boat’s static thrust, jet velocity and thrust at speed from momentum theory, the spread across the class, and what a rule change would do.',
  },
];

export default function LandingPage() {
  return (
    <div className="space-y-10">
      <section className="space-y-4">
        <p className="text-sm font-bold uppercase tracking-widest text-flare-600">
          For jet sprint and river race meetings
        </p>
        <h1 className="max-w-3xl text-4xl">
          Technical inspection and class parity, from the dock to the published report.
        </h1>
        <p className="max-w-2xl text-lg text-ink-soft">
          Boreline replaces paper tech cards and spreadsheets for organisers, scrutineers, stewards and entrants: one
          record of every boat&apos;s declaration, measurement, verdict and protest, built for phones in wet hands and
          bright sun.
        </p>
        <div className="flex flex-wrap gap-3">
          <Link href="/sign-up" className="btn-primary">
            Create an entrant account
          </Link>
          <Link href="/sign-in" className="btn-secondary">
            Sign in
          </Link>
          <Link href="/calculator" className="btn-secondary">
            Try the jet calculator
          </Link>
        </div>
      </section>
      <section aria-labelledby="how" className="space-y-4">
        <h2 id="how">How a meeting runs on Boreline</h2>
        <ol className="grid gap-4 sm:grid-cols-2">
          {STEPS.map((s, i) => (
            <li key={s.title} className="card">
              <span className="figure text-sm text-ink-mute">{String(i + 1).padStart(2, '0')}</span>
              <h3 className="mt-1">{s.title}</h3>
              <p className="mt-2 text-ink-soft">{s.text}</p>
            </li>
          ))}
        </ol>
      </section>
      <SafetyNote />
    </div>
  );
}
