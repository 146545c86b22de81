'use client';

import type { LengthBudget } from '@/lib/core/engine/measurement-thermal';

// A figure that may be tiny (an expansion coefficient, its sensitivity): four significant digits,
// with a power of ten when it would otherwise be all zeros.
function sig(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) return Number(v.toPrecision(4)).toString();
  const [m, e] = v.toExponential(3).split('e');
  return `${m}×10^${Number(e)}`;
}
const mm = (v: number) => v.toFixed(4);

/**
 * The nozzle's uncertainty budget as a table (JCGM 100:2008, 5.1.2): each input quantity's value,
 * standard uncertainty, sensitivity coefficient and contribution, then u_c, k and U. It scrolls
 * sideways on a narrow phone rather than squeezing the figures.
 */
export function BudgetTable({ budget, caption }: { budget: LengthBudget; caption: string }) {
  return (
    <details className="rounded-lg border border-paper-line p-2" data-testid="uncertainty-budget">
      <summary className="min-h-[3rem] cursor-pointer py-2 font-bold">
        Uncertainty budget: U = {mm(budget.expandedUncertaintyMm)} mm
      </summary>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Uncertainty budget">
        <table className="figure w-full min-w-[32rem] text-left text-base">
          <caption className="py-1 text-left text-ink-soft">{caption}</caption>
          <thead>
            <tr className="border-b border-paper-line">
              <th scope="col" className="py-1 pr-2">
                Quantity
              </th>
              <th scope="col" className="py-1 pr-2">
                Value
              </th>
              <th scope="col" className="py-1 pr-2">
                u(x)
              </th>
              <th scope="col" className="py-1 pr-2">
                c = ∂L20/∂x
              </th>
              <th scope="col" className="py-1">
                |c|·u, mm
              </th>
            </tr>
          </thead>
          <tbody>
            {budget.terms.map((t) => (
              <tr key={t.quantity} className="border-b border-paper-line align-top" data-budget-term={t.quantity}>
                <th scope="row" className="py-1 pr-2 font-normal">
                  {t.quantity}
                  <span className="block text-sm text-ink-soft">{t.basis}</span>
                </th>
                <td className="py-1 pr-2">
                  {sig(t.value)} {t.unit}
                </td>
                <td className="py-1 pr-2">
                  {sig(t.standardUncertainty)} {t.unit}
                </td>
                <td className="py-1 pr-2">{sig(t.sensitivity)}</td>
                <td className="py-1">{mm(t.contributionMm)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr>
              <th scope="row" colSpan={4} className="py-1 pr-2">
                Combined standard uncertainty u_c (in quadrature)
              </th>
              <td className="py-1" data-testid="budget-uc">
                {mm(budget.combinedStandardUncertaintyMm)}
              </td>
            </tr>
            <tr>
              <th scope="row" colSpan={4} className="py-1 pr-2">
                Coverage factor k (about 95 %)
              </th>
              <td className="py-1">{budget.coverageFactor}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={4} className="py-1 pr-2">
                Expanded uncertainty U = k·u_c
              </th>
              <td className="py-1 font-bold" data-testid="budget-u">
                {mm(budget.expandedUncertaintyMm)}
              </td>
            </tr>
          </tfoot>
        </table>
      </div>
    </details>
  );
}
