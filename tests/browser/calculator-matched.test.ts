// Journey: the calculator's matched mode on a phone, signed out. The page shows what the engine's
// computeMatchedPerformance computes for the same inputs (the engine itself is checked against the
// affinity laws and the momentum balance in tests/integration/matched-api.test.ts and the unit
// tests); here the screen is checked against it: the static thrust and the cavitation flag, a
// curve broken (rpm not increasing) with the message beside the field, a nozzle so small that no
// operating point exists, said in words, and the mode kept in the address.
// The curves are the illustrative, invented ones the page is prefilled with.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import type { Browser, Locator } from 'playwright-core';
import { launchBrowser, newContext, screenshot, PHONE } from '../support/browser';
import { computeJetPerformance, computeMatchedPerformance } from '../../lib/core/engine/calculation-api';
import { EngineOperatingPointError } from '../../lib/core/engine/engine-input-error';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

async function waitForText(locator: Locator, pattern: RegExp, timeoutMs = 15_000): Promise<RegExpMatchArray> {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < deadline) {
    last = (await locator.innerText().catch(() => '')) ?? '';
    const m = last.match(pattern);
    if (m) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`text never matched ${pattern}; last seen: ${JSON.stringify(last)}`);
}

// The page's prefilled example, as a body (invented curves; K_i 0.2 and K_n 0.02 are common practice, no source).
const INPUT = {
  engine: {
    curve: [
      { rpm: 1500, powerKw: 60 },
      { rpm: 3000, powerKw: 170 },
      { rpm: 4500, powerKw: 260 },
      { rpm: 5500, powerKw: 300 },
      { rpm: 6200, powerKw: 290 },
    ],
  },
  pump: {
    impellerDiameterMm: 240,
    curve: [
      { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
      { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
      { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
      { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
      { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
      { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
    ],
  },
  nozzleDiameterMm: 100,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  water: { kind: 'fresh' as const, temperatureC: 15 },
  cavitation: { inletDepthM: 0.2, suctionSpecificSpeed: 6 },
  speedsMs: [0, 30],
};

test('calculator, matched mode: static thrust as the engine computes it, a broken curve, no operating point', async () => {
  const [atRest, at30] = computeMatchedPerformance(INPUT).points;
  let noPoint: EngineOperatingPointError | undefined;
  try {
    computeMatchedPerformance({ ...INPUT, nozzleDiameterMm: 40, speedsMs: [0] });
  } catch (err) {
    if (err instanceof EngineOperatingPointError) noPoint = err;
  }
  assert.ok(noPoint, 'a 40 mm nozzle has no operating point at rest with these curves');
  assert.equal(noPoint.curve, 'pump');

  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  await page.goto('/calculator');
  await page.getByRole('button', { name: 'Matched to engine and pump' }).click();
  const mode = page.getByTestId('matched-mode');
  await mode.waitFor();
  assert.equal(new URL(page.url()).searchParams.get('mode'), 'matched', 'the mode is in the address');
  assert.match(await page.getByTestId('matched-illustrative').innerText(), /illustrative, invented example/);
  assert.match(
    await page.getByTestId('matched-caution').innerText(),
    /idealised model; the governing body's rules and licensed officials decide/,
  );

  const row0 = page.getByTestId('matched-row-0');
  const [, shown] = await waitForText(row0.getByTestId('thrust'), /^(\d+) N$/);
  // Shown to 1 N.
  assert.ok(Math.abs(Number(shown) - atRest.thrustN) <= 0.5 + 1e-9, `static thrust ${shown} vs ${atRest.thrustN}`);
  assert.equal(atRest.cavitating, true, 'the example cavitates at rest');
  assert.match(await row0.getByTestId('cavitation').innerText(), /^cavitating/);
  const [, shown30] = await waitForText(page.getByTestId('matched-row-30').getByTestId('thrust'), /^(\d+) N$/);
  assert.ok(Math.abs(Number(shown30) - at30.thrustN) <= 0.5 + 1e-9, `thrust at 30 m/s ${shown30} vs ${at30.thrustN}`);
  // The comparison column: the fixed-power model with the rest point's power and efficiency held. At rest it is
  // the matched figure itself (momentum theory at fixed power is the matched model's special case, Allison 1993).
  const [fixedAtRest, fixed30] = computeJetPerformance({
    powerKw: atRest.shaftPowerKw,
    pumpEfficiency: atRest.pumpEfficiency,
    nozzleDiameterMm: 100,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    water: INPUT.water,
    speedsMs: [0, 30],
  }).points;
  assert.ok(Math.abs(fixedAtRest.thrustN - atRest.thrustN) <= 1e-9 * atRest.thrustN, 'identity at rest');
  const [, shownFixed30] = await waitForText(
    page.getByTestId('matched-row-30').getByTestId('fixed-thrust'),
    /^(\d+) N$/,
  );
  assert.ok(Math.abs(Number(shownFixed30) - fixed30.thrustN) <= 0.5 + 1e-9, `fixed power at 30 m/s ${shownFixed30}`);
  assert.match(
    await page.getByTestId('matched-row-30').getByTestId('cavitation').innerText(),
    at30.cavitating ? /^cavitating/ : /^no/,
  );

  // The chart loads lazily; the cavitating speeds are shaded and said.
  const chart = page.getByTestId('matched-chart');
  await chart.locator('path.recharts-line-curve').first().waitFor();
  assert.equal(await chart.locator('path.recharts-line-curve').count(), 2, 'matched and fixed-power curves');
  assert.ok((await chart.locator('.recharts-reference-area').count()) >= 1, 'cavitating region shaded');
  const label = (await chart.getByTestId('matched-cavitation-label').first().textContent()) ?? '';
  assert.match(label.replace(/\s+/g, ' '), /cavitating: the thrust is an upper bound/);
  assert.ok(
    await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth),
    'no sideways scrolling of the page',
  );
  await screenshot(page, 'calculator-matched-01-example');

  // rpm not increasing: the message beside that field, the typed text kept, no figures.
  const rpm3 = mode.getByLabel('Engine point 3 speed (rpm)', { exact: true });
  await rpm3.fill('2000');
  await waitForText(page.locator('[data-field-error="m-engine-2-rpm"]'), /rpm must increase from point to point/);
  assert.equal(await rpm3.getAttribute('aria-invalid'), 'true');
  assert.equal(await rpm3.inputValue(), '2000', 'what was typed is kept');
  await waitForText(page.getByTestId('matched-problem'), /Correct the marked fields/);
  await screenshot(page, 'calculator-matched-02-broken-curve');
  await rpm3.fill('4500');
  await waitForText(row0.getByTestId('thrust'), /^\d+ N$/);

  // A nozzle so small that the engine and pump never meet: the engine's own words beside the pump curve.
  const nozzle = mode.getByLabel('Nozzle exit diameter', { exact: true });
  await nozzle.fill('40');
  const beside = page.locator('[data-field-error="m-pump-curve"]');
  await waitForText(beside, /No operating point/);
  assert.ok((await beside.innerText()).includes(noPoint.message), `engine message shown: ${noPoint.message}`);
  await waitForText(page.getByTestId('matched-problem'), /No operating point at any speed/);
  assert.equal(await nozzle.inputValue(), '40');
  await screenshot(page, 'calculator-matched-03-no-operating-point');

  // Switching modes keeps what was typed.
  await page.getByRole('button', { name: 'Fixed shaft power' }).click();
  assert.equal(new URL(page.url()).searchParams.get('mode'), null);
  await page.getByRole('button', { name: 'Matched to engine and pump' }).click();
  assert.equal(await nozzle.inputValue(), '40', 'kept across a mode switch');

  // A link with ?mode=matched opens the matched mode.
  await page.goto('/calculator?mode=matched');
  await page.getByTestId('matched-row-0').getByTestId('thrust').waitFor();
  assert.equal(
    await page.getByRole('button', { name: 'Matched to engine and pump' }).getAttribute('aria-pressed'),
    'true',
  );
  await context.close();
});
