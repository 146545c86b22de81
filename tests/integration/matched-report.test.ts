// Issue 19, items 2–4: a class whose rules choose the matched model reports a boat that declared both an
// engine curve and a pump curve where its engine and pump settle; the others at fixed power, and the
// report says which per boat (draft, published JSON, CSV, page). Through the real HTTP API and database.
// The curves, class figures and evidence shares are invented for this test; every matched figure is
// checked against the engine's evaluateMatchedPoint and against the two balances computed here by hand
// (pump affinity laws: Karassik, Pump Handbook; Brennen, Hydrodynamics of Pumps, 1994).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { parse } from 'csv-parse/sync';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { evaluateMatchedPoint, prepareMatchedSetup, type MatchedPoint } from '../../lib/core/engine/jet-matched';
import { saturationPressurePa, STANDARD_GRAVITY } from '../../lib/core/engine/cavitation';

const meeting = new InspectionMeeting();
const owner = new HttpSession();
const scrutineer = new HttpSession();
let classId = '';
let matchedBoat: TestEntry;
let plainBoat: TestEntry;

const engine = {
  curve: [
    { rpm: 3000, powerKw: 150 },
    { rpm: 5000, powerKw: 260 },
    { rpm: 7000, powerKw: 300 },
  ],
  limiterRpm: 7200,
};
const pump = {
  impellerDiameterMm: 212,
  curve: [
    { flowCoefficient: 0.05, headCoefficient: 8, efficiency: 0.82 },
    { flowCoefficient: 0.3, headCoefficient: 4.5, efficiency: 0.9 },
    { flowCoefficient: 0.6, headCoefficient: 0.5, efficiency: 0.8 },
  ],
};
// A low suction specific speed, so that the pump cavitates at rest (Brennen 1994, 1.7: S = ω Q^½ / (g NPSH_r)^¾).
const suction = { inletDepthM: 0.2, suctionSpecificSpeed: 2 };
const parity = {
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
  referenceSpeedsMs: [10, 20],
  reportModel: 'matched',
};
const shares = { dyno_sheet: 0.04, maker_rating: 0.1, declaration_only: 0.2 };

type Draft = {
  inputs: {
    assumptions: { reportModel: string; powerEvidenceShares: Record<string, number | string> };
    density: { densityKgM3: number };
    boats: { entryId: string; powerKw: number; uPowerKw: number; nozzleDiameterMm: number }[];
  };
  results: {
    parity: {
      summary: { medianStaticThrustN: number };
      boats: { id: string; staticThrustN: number; thrustAtReferenceSpeeds: { speedMs: number; thrustN: number }[] }[];
    };
    modelUsed: Record<
      string,
      {
        model: string;
        reason?: string;
        declaredPeakKw?: number;
        scaledToKw?: number;
        points?: (MatchedPoint & {
          uThrustN: number;
          cavitating: boolean | null;
          availableNpshM: number;
          requiredNpshM: number;
        })[];
      }
    >;
  };
};

before(async () => {
  await meeting.create(`Matched Report Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  classId = await meeting.addClass(
    'MR',
    rulesWith({ parity, power: { minKw: null, maxKw: null, defaultUncertaintyKw: 5, evidenceShares: shares } }),
  );
  matchedBoat = await meeting.addEntry(classId);
  plainBoat = await meeting.addEntry(classId);
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  // The curves are declared before the inspection, so the inspected version holds them.
  const put = await owner.json(
    `/api/boats/${matchedBoat.boatId}/performance`,
    { engine: { kind: 'points', ...engine }, pump: { kind: 'points', ...pump }, suction },
    'PUT',
  );
  assert.equal(put.res.status, 200, JSON.stringify(put.body));
  for (const e of [matchedBoat, plainBoat]) {
    const r = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(e.id, 101.9));
    assert.equal(r.res.status, 201, JSON.stringify(r.body));
    assert.equal(r.body.data.overallResult, 'conforms');
  }
});

const interpolate = (x: number, xs: number[], ys: number[]) => {
  for (let j = 0; j < xs.length - 1; j++)
    if (x >= xs[j] && x <= xs[j + 1]) return ys[j] + ((ys[j + 1] - ys[j]) * (x - xs[j])) / (xs[j + 1] - xs[j]);
  throw new Error(`${x} outside the curve`);
};

test('the matched boat’s figures are the matched model’s; the other boat stays on fixed power and says why', async () => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`);
  assert.equal(res.status, 200);
  const draft = (await res.json()).data.draft as Draft;
  assert.equal(draft.inputs.assumptions.reportModel, 'matched');
  const used = draft.results.modelUsed;
  assert.equal(used[plainBoat.id].model, 'fixed_power');
  assert.match(used[plainBoat.id].reason!, /No engine curve and pump curve/);
  assert.equal(used[matchedBoat.id].model, 'matched');

  const input = draft.inputs.boats.find((b) => b.entryId === matchedBoat.id)!;
  const rho = draft.inputs.density.densityKgM3;
  // The declared curve's shape at the power the inspection confirmed: its 300 kW peak scaled to the boat's.
  assert.equal(used[matchedBoat.id].declaredPeakKw, 300);
  assert.equal(used[matchedBoat.id].scaledToKw, input.powerKw);
  const levelled = { curve: engine.curve.map((c) => ({ rpm: c.rpm, powerKw: (c.powerKw * input.powerKw) / 300 })) };
  const setup = prepareMatchedSetup({
    engine: levelled,
    pump,
    nozzleDiameterMm: input.nozzleDiameterMm,
    densityKgM3: rho,
    nozzleLossCoefficient: parity.nozzleLossCoefficient,
    inletLossCoefficient: parity.inletLossCoefficient,
    wakeFraction: parity.wakeFraction,
  });
  const figures = draft.results.parity.boats.find((b) => b.id === matchedBoat.id)!;
  const points = used[matchedBoat.id].points!;
  assert.deepEqual(
    points.map((p) => p.speedMs),
    [0, 10, 20],
  );
  const out = {} as MatchedPoint;
  for (const p of points) {
    const expected = evaluateMatchedPoint(setup, p.speedMs, out);
    assert.ok(
      Math.abs(p.thrustN / expected.thrustN - 1) < 1e-12,
      `${p.speedMs} m/s: ${p.thrustN} vs ${expected.thrustN}`,
    );
  }
  // The table's static thrust and thrust at each reference speed are those matched points.
  assert.equal(figures.staticThrustN, points[0].thrustN);
  assert.deepEqual(
    figures.thrustAtReferenceSpeeds.map((t) => t.thrustN),
    [points[1].thrustN, points[2].thrustN],
  );

  // Independent of the solver: at rest the pump's head equals the system's, and the power it absorbs
  // equals the engine's at that rpm (affinity laws, Karassik; Brennen 1994).
  const p0 = points[0];
  const n = p0.rpm / 60;
  const d = pump.impellerDiameterMm / 1000;
  const phi = p0.flowM3s / (n * d ** 3);
  const phis = pump.curve.map((c) => c.flowCoefficient);
  const psi = interpolate(
    phi,
    phis,
    pump.curve.map((c) => c.headCoefficient),
  );
  const eta = interpolate(
    phi,
    phis,
    pump.curve.map((c) => c.efficiency),
  );
  const area = (Math.PI * (input.nozzleDiameterMm / 1000) ** 2) / 4;
  const pumpHead = psi * n * n * d * d;
  const systemHead = 0.5 * (1 + parity.nozzleLossCoefficient) * (p0.flowM3s / area) ** 2;
  assert.ok(Math.abs(pumpHead / systemHead - 1) < 1e-9, `head ${pumpHead} vs ${systemHead}`);
  const absorbedW = (rho * p0.flowM3s * pumpHead) / eta;
  const engineW =
    interpolate(
      p0.rpm,
      levelled.curve.map((c) => c.rpm),
      levelled.curve.map((c) => c.powerKw),
    ) * 1000;
  assert.ok(Math.abs(absorbedW / engineW - 1) < 1e-9, `power ${absorbedW} vs ${engineW}`);
  // Momentum: T = rho Q v_j at rest.
  assert.ok(Math.abs(p0.thrustN / (rho * p0.flowM3s * (p0.flowM3s / area)) - 1) < 1e-12);
});

test('cavitation is flagged where NPSH available is below NPSH required, computed here by hand', async () => {
  const draft = (
    await (await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`)).json()
  ).data.draft as Draft;
  const rho = draft.inputs.density.densityKgM3;
  const g = STANDARD_GRAVITY;
  // The meeting's water is 15 °C (InspectionMeeting); the boat did not declare a temperature.
  const pv = saturationPressurePa(288.15);
  for (const p of draft.results.modelUsed[matchedBoat.id].points!) {
    // NPSH_a = (p_atm − p_v)/(ρg) + z + (1 − K_i) V²/(2g); NPSH_r = (ω Q^½ / S)^(4/3) / g (Brennen 1994, 1.7).
    const available = (101_325 - pv) / (rho * g) + suction.inletDepthM + ((1 - 0.2) * p.speedMs ** 2) / (2 * g);
    const required =
      (((p.rpm * 2 * Math.PI) / 60) * Math.sqrt(p.flowM3s)) ** (4 / 3) / suction.suctionSpecificSpeed ** (4 / 3) / g;
    assert.ok(Math.abs(p.availableNpshM / available - 1) < 1e-9);
    assert.ok(Math.abs(p.requiredNpshM / required - 1) < 1e-9);
    assert.equal(p.cavitating, available < required);
  }
  assert.equal(draft.results.modelUsed[matchedBoat.id].points![0].cavitating, true, 'flagged at rest');
});

test('the class’s own power shares set the power uncertainty (maker’s rating seen: 10 % of 220 kW, k = 2)', async () => {
  const draft = (
    await (await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`)).json()
  ).data.draft as Draft;
  assert.equal(draft.inputs.assumptions.powerEvidenceShares.source, 'class');
  const plain = draft.inputs.boats.find((b) => b.entryId === plainBoat.id)!;
  // Evidence seen with no kind named counts as a maker's rating; U = max(5 kW, 0.10 × 220 kW) = 22 kW, u = U/2.
  assert.equal(plain.powerKw, 220);
  assert.ok(Math.abs(plain.uPowerKw - 11) < 1e-12);
});

test('published: the JSON, the CSV and the page say which model each boat used and flag the upper bound', async () => {
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes/${classId}/report/publish`, {
    note: 'matched',
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const id = pub.body.data.publicId;
  const json = (await (await fetch(`${BASE_URL}/api/reports/${id}`)).json()).data;
  assert.equal(json.results.modelUsed[matchedBoat.id].model, 'matched');
  const csv = parse(await (await fetch(`${BASE_URL}/api/reports/${id}/csv`)).text(), { columns: true }) as Record<
    string,
    string
  >[];
  const row = (e: TestEntry) => csv.find((r) => Number(r.race_number) === e.raceNumber)!;
  assert.equal(row(matchedBoat).model, 'matched');
  assert.equal(row(plainBoat).model, 'fixed_power');
  assert.match(row(matchedBoat).cavitating_at_ms, /^0( |$)/);
  assert.equal(Number(row(matchedBoat).static_thrust_n), json.results.modelUsed[matchedBoat.id].points[0].thrustN);
  const page = await (await fetch(`${BASE_URL}/reports/${id}`)).text();
  assert.match(page, /Model per boat/);
  assert.match(page, /upper bound/);
  assert.match(page, /officials decide/);
  const pdf = await fetch(`${BASE_URL}/api/reports/${id}/pdf`);
  assert.equal(pdf.status, 200);
});
