// /calculator: public thrust calculator for organisers and entrants, signed in or not.
import type { Metadata } from 'next';
import { Calculator } from './calculator';
import { CalculatorModes } from './mode-switch';

export const metadata: Metadata = {
  title: 'Thrust calculator',
  description:
    'Compare water-jet set-ups: static thrust, jet velocity and thrust against boat speed from momentum theory.',
};

export default async function CalculatorPage({
  searchParams,
}: {
  searchParams: Promise<{ mode?: string | string[] }>;
}) {
  const { mode } = await searchParams;
  return (
    <div className="space-y-8">
      <header className="space-y-3">
        <p className="text-sm font-bold uppercase tracking-widest text-flare-600">Public calculator</p>
        <h1>Thrust calculator</h1>
        <p className="max-w-2xl text-lg text-ink-soft">
          Enter up to four pump and nozzle set-ups and compare how hard each pushes at rest and as the boat gathers
          speed. Nothing is stored; every unit can be changed.
        </p>
      </header>

      <CalculatorModes initialMode={mode === 'matched' ? 'matched' : 'fixed'} fixed={<Calculator />} />

      <section aria-labelledby="meaning" className="max-w-3xl space-y-3">
        <h2 id="meaning">What the numbers mean</h2>
        <p>
          A water jet makes thrust by taking water in at the boat&apos;s speed and throwing it out of the nozzle faster.
          The thrust is the mass of water moved each second times how much faster it leaves than it arrived; the
          engine&apos;s shaft power sets how much energy the pump can give that water each second. This is momentum
          theory.
        </p>
        <p>
          <strong>At rest</strong>, for the same power, a larger nozzle moves more water more slowly and pushes harder:
          static thrust grows with the nozzle diameter to the power 2/3. A smaller nozzle gives a faster jet, since jet
          velocity falls with the diameter to the same power.
        </p>
        <p>
          <strong>At speed</strong>, water reaches the inlet already moving, and the jet only pushes by the amount it
          outruns the boat. With a perfect pump and no losses the larger nozzle would still win at every speed. Real
          pumps lose energy in the inlet duct and the nozzle and are less than perfectly efficient; those losses cost
          the slow, heavy jet of a large nozzle more as speed rises, so the curves cross. Above the crossover the
          smaller nozzle has more thrust — which is why large nozzles suit acceleration and heavy boats and small ones
          suit top speed.
        </p>
        <p className="text-ink-soft">
          This is an idealised model: power is taken as constant at every speed, and hull drag, cavitation, ventilation
          and engine matching are left out. Use it to compare set-ups against each other, not to predict a boat&apos;s
          top speed.
        </p>
        <h3>Sources of the model</h3>
        <ul className="list-disc space-y-1 pl-6 text-ink-soft">
          <li>
            Allison, &ldquo;Marine Waterjet Propulsion&rdquo;, SNAME Transactions 101 (1993): the momentum and power
            balance of a water jet.
          </li>
          <li>
            Faltinsen, <cite>Hydrodynamics of High-Speed Marine Vehicles</cite> (2005), section 2.11: water-jet thrust
            and losses.
          </li>
          <li>
            MIT 2.611 Ship Power and Propulsion course notes (2006): the form of the inlet and nozzle loss coefficients.
          </li>
          <li>Water density: ITTC Recommended Procedure 7.5-02-01-03. Unit factors: NIST SP 811 (2008), appendix B.</li>
        </ul>
        <p className="text-ink-soft">
          The same figures are available to programs from the public API, described at{' '}
          <a href="/api/v1/openapi.json">/api/v1/openapi.json</a> (OpenAPI 3.1).
        </p>
      </section>
    </div>
  );
}
