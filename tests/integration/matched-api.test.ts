// POST /api/v1/jet-performance/matched through real HTTP: the contract's answer shape, both balances
// re-checked here from the answer (pump affinity laws, Karassik's Pump Handbook; momentum balance,
// Allison 1993), the identity with the fixed-power route on a flat engine curve at constant pump
// efficiency, 400 naming the field, 422 naming the curve, and the OpenAPI entry.
// The pump and engine curves are illustrative shapes (invented), not a maker's data.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL } from '../support/env';

function clientAddress(): string {
  const hex = () => Math.floor(Math.random() * 0xffff).toString(16);
  return `2001:db8:${hex()}:${hex()}::${hex()}`;
}

async function post(path: string, body: unknown) {
  const res = await fetch(`${BASE_URL}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': clientAddress() },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
  return { res, body: await res.json().catch(() => null) };
}

const PUMP = {
  impellerDiameterMm: 240,
  curve: [
    { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
    { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
    { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
    { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
    { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
    { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
  ],
};
const ENGINE = {
  curve: [
    { rpm: 1500, powerKw: 60 },
    { rpm: 3000, powerKw: 170 },
    { rpm: 4500, powerKw: 260 },
    { rpm: 5500, powerKw: 300 },
    { rpm: 6200, powerKw: 290 },
  ],
};
const LOSSES = { nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2 };

const lerp = (xs: number[], ys: number[], x: number) => {
  for (let i = 0; i < xs.length - 1; i++)
    if (x >= xs[i] && x <= xs[i + 1]) return ys[i] + ((ys[i + 1] - ys[i]) * (x - xs[i])) / (xs[i + 1] - xs[i]);
  throw new Error(`${x} outside the curve`);
};

test('matched: the contract shape, and each point solves the head and power balances', async () => {
  const { res, body } = await post('/api/v1/jet-performance/matched', {
    engine: ENGINE,
    pump: PUMP,
    nozzleDiameterMm: 100,
    speedsMs: [0, 10, 20, 30],
    ...LOSSES,
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  // Default water: fresh at 15 C, 999.1026 kg/m^3 (ITTC Recommended Procedure 7.5-02-01-03).
  assert.ok(Math.abs(body.data.densityKgM3 - 999.1026) < 1e-4);
  const rho = body.data.densityKgM3;
  assert.equal(body.data.points.length, 4);
  const d = 0.24;
  const area = (Math.PI * 0.1 ** 2) / 4;
  for (const p of body.data.points) {
    assert.deepEqual(Object.keys(p).sort(), [
      'flowCoefficient',
      'flowM3s',
      'jetVelocityMs',
      'limitedBy',
      'pumpEfficiency',
      'rpm',
      'shaftPowerKw',
      'speedMs',
      'thrustN',
    ]);
    assert.equal(p.limitedBy, 'engine');
    const n = p.rpm / 60;
    const phi = p.flowM3s / (n * d ** 3);
    assert.ok(Math.abs(phi - p.flowCoefficient) < 1e-12 * phi, 'Q = phi n D^3');
    const phis = PUMP.curve.map((c) => c.flowCoefficient);
    const psi = lerp(
      phis,
      PUMP.curve.map((c) => c.headCoefficient),
      phi,
    );
    const eta = lerp(
      phis,
      PUMP.curve.map((c) => c.efficiency),
      phi,
    );
    const pumpHead = psi * n * n * d * d;
    const vin = p.speedMs;
    const systemHead = 0.5 * 1.02 * (p.flowM3s / area) ** 2 - 0.5 * 0.8 * vin * vin;
    assert.ok(Math.abs(pumpHead - systemHead) <= 1e-9 * pumpHead, `head balance at ${p.speedMs} m/s`);
    const absorbed = (rho * p.flowM3s * pumpHead) / eta;
    const engine =
      1000 *
      lerp(
        ENGINE.curve.map((c) => c.rpm),
        ENGINE.curve.map((c) => c.powerKw),
        p.rpm,
      );
    assert.ok(Math.abs(absorbed - engine) <= 1e-9 * engine, `power balance at ${p.speedMs} m/s`);
    assert.ok(Math.abs(p.shaftPowerKw * 1000 - absorbed) <= 1e-9 * absorbed);
    assert.ok(Math.abs(p.pumpEfficiency - eta) < 1e-12);
    assert.ok(Math.abs(p.jetVelocityMs - p.flowM3s / area) < 1e-9 * p.jetVelocityMs);
    assert.ok(Math.abs(p.thrustN - rho * p.flowM3s * (p.jetVelocityMs - vin)) < 1e-9 * p.thrustN);
  }
});

test('matched: a flat engine curve at constant pump efficiency gives the fixed-power route’s thrust', async () => {
  // Momentum theory at fixed shaft power (Allison 1993) is the matched model's special case: with eta
  // constant, rho Q gH / eta = P is the fixed-power energy balance term for term.
  const speeds = [0, 15, 30];
  const flat = {
    curve: [
      { rpm: 500, powerKw: 300 },
      { rpm: 20_000, powerKw: 300 },
    ],
  };
  const pump = { ...PUMP, curve: PUMP.curve.map((c) => ({ ...c, efficiency: 0.9 })) };
  const matched = await post('/api/v1/jet-performance/matched', {
    engine: flat,
    pump,
    nozzleDiameterMm: 100,
    speedsMs: speeds,
    wakeFraction: 0.05,
    ...LOSSES,
  });
  const fixed = await post('/api/v1/jet-performance', {
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: speeds,
    pumpEfficiency: 0.9,
    wakeFraction: 0.05,
    ...LOSSES,
  });
  assert.equal(matched.res.status, 200, JSON.stringify(matched.body));
  assert.equal(fixed.res.status, 200);
  for (let i = 0; i < speeds.length; i++) {
    const a = matched.body.data.points[i].thrustN;
    const b = fixed.body.data.points[i].thrustN;
    assert.ok(Math.abs(a - b) <= 1e-9 * b, `${speeds[i]} m/s: ${a} vs ${b}`);
  }
});

test('matched: the limiter caps the rpm and says so', async () => {
  const { res, body } = await post('/api/v1/jet-performance/matched', {
    engine: { ...ENGINE, limiterRpm: 3000 },
    pump: PUMP,
    nozzleDiameterMm: 100,
    speedsMs: [0],
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  assert.equal(body.data.points[0].limitedBy, 'limiter');
  assert.equal(body.data.points[0].rpm, 3000);
  assert.ok(body.data.points[0].shaftPowerKw < 170, 'below the engine curve at 3000 rpm');
});

test('matched: bad fields are 400 naming the field; no operating point is 422 naming the curve', async () => {
  const base = { engine: ENGINE, pump: PUMP, nozzleDiameterMm: 100, speedsMs: [0] };
  const bad: [unknown, string][] = [
    [{ ...base, engine: { curve: [ENGINE.curve[1], ENGINE.curve[0]] } }, 'engine.curve.1.rpm'],
    [{ ...base, engine: { curve: [ENGINE.curve[0]] } }, 'engine.curve'],
    [{ ...base, pump: { ...PUMP, curve: [PUMP.curve[2], PUMP.curve[1]] } }, 'pump.curve.1.flowCoefficient'],
    [{ ...base, pump: { ...PUMP, impellerDiameterMm: -5 } }, 'pump.impellerDiameterMm'],
    [
      { ...base, pump: { ...PUMP, curve: [PUMP.curve[0], { ...PUMP.curve[1], efficiency: 1.5 }] } },
      'pump.curve.1.efficiency',
    ],
    [{ ...base, pumpEfficiency: 0.9 }, '(body)'],
    [{ ...base, speedsMs: ['10'] }, 'speedsMs.0'],
  ];
  for (const [body, field] of bad) {
    const r = await post('/api/v1/jet-performance/matched', body);
    assert.equal(r.res.status, 400, `${field}: ${JSON.stringify(r.body)}`);
    assert.equal(r.body.error.code, 'invalid_input');
    assert.ok(
      r.body.error.details.some((d: { field: string }) => d.field === field),
      `${field} named in ${JSON.stringify(r.body.error.details)}`,
    );
  }
  const none: [unknown, 'engine' | 'pump'][] = [
    [{ ...base, nozzleDiameterMm: 40 }, 'pump'],
    [{ ...base, nozzleDiameterMm: 400 }, 'pump'],
    [{ ...base, pump: { ...PUMP, impellerDiameterMm: 420 }, nozzleDiameterMm: 175 }, 'engine'],
    [{ ...base, engine: { ...ENGINE, limiterRpm: 1000 } }, 'engine'],
  ];
  for (const [body, curve] of none) {
    const r = await post('/api/v1/jet-performance/matched', body);
    assert.equal(r.res.status, 422, JSON.stringify(r.body));
    assert.equal(r.body.error.code, 'no_operating_point');
    assert.equal(r.body.error.details[0].field, curve);
    assert.equal(r.body.error.details[0].speedMs, 0);
  }
});

test('matched: listed in the OpenAPI document with its 422', async () => {
  const res = await fetch(`${BASE_URL}/api/v1/openapi.json`, { headers: { 'x-forwarded-for': clientAddress() } });
  const doc = await res.json();
  const op = doc.paths['/api/v1/jet-performance/matched']?.post;
  assert.ok(op, 'listed');
  assert.ok(op.responses['422'], '422 documented');
  const input = doc.components.schemas.MatchedInput;
  assert.deepEqual([...input.required].sort(), ['engine', 'nozzleDiameterMm', 'pump', 'speedsMs']);
  assert.equal(input.additionalProperties, false);
  assert.ok(!('pumpEfficiency' in input.properties), 'the efficiency comes from the pump curve');
});

test('matched: with cavitation each point carries NPSH available and required and the flag', async () => {
  const { res, body } = await post('/api/v1/jet-performance/matched', {
    engine: ENGINE,
    pump: PUMP,
    nozzleDiameterMm: 100,
    speedsMs: [0, 25],
    ...LOSSES,
    cavitation: { inletDepthM: 0.2, suctionSpecificSpeed: 6 },
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  const [rest, fast] = body.data.points;
  assert.equal(rest.cavitating, true);
  assert.equal(fast.cavitating, false);
  // NPSH_a = (p_atm - p_v)/(rho g) + z + (1 - K_i) V_in^2/(2 g); p_v(15 °C) = 1705.7 Pa (IAPWS-IF97).
  const g = 9.80665;
  assert.ok(Math.abs(rest.availableNpshM - ((101325 - 1705.74) / (999.1026 * g) + 0.2)) < 1e-3);
  const both = await post('/api/v1/jet-performance/matched', {
    engine: ENGINE,
    pump: PUMP,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    cavitation: {
      inletDepthM: 0.2,
      suctionSpecificSpeed: 6,
      requiredNpshAtRated: { npshM: 10, rpm: 5000, flowM3s: 0.3 },
    },
  });
  assert.equal(both.res.status, 400);
  assert.match(both.body.error.message, /either suctionSpecificSpeed or requiredNpshAtRated/);
  // Without cavitation the answer has none of these keys (the contract's exact shape).
  const plain = await post('/api/v1/jet-performance/matched', {
    engine: ENGINE,
    pump: PUMP,
    nozzleDiameterMm: 100,
    speedsMs: [0],
  });
  assert.ok(!('cavitating' in plain.body.data.points[0]));
});
