// The public calculation API through real HTTP against the running app: worked values of momentum
// theory and of the decision rules (sources beside each check), refusals of bad bodies with the field named, the generated OpenAPI document, and the
// per-client rate limit kept in PostgreSQL.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL } from '../support/env';
import { query } from '../support/db';
import { fromAddress, randomLoopback } from '../support/from-address';

// Every request carries an X-Forwarded-For from the IPv6 documentation range (RFC 3849). With no
// proxy declared (the test app, like the demo) it counts for nothing: the socket is the client. The
// rate-limit test tells clients apart by their loopback source address instead.
function clientAddress(): string {
  const hex = () => Math.floor(Math.random() * 0xffff).toString(16);
  return `2001:db8:${hex()}:${hex()}::${hex()}`;
}

async function post(path: string, body: unknown, headers: Record<string, string> = {}) {
  const res = await fetch(`${BASE_URL}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': clientAddress(), ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
  return { res, body: await res.json().catch(() => null) };
}

function assertClose(actual: number, expected: number, tolerance: number, what: string) {
  assert.equal(typeof actual, 'number', `${what} is a number`);
  assert.ok(Math.abs(actual - expected) <= tolerance, `${what}: got ${actual}, expected ${expected} ± ${tolerance}`);
}

const LOSSES = { pumpEfficiency: 0.9, inletLossCoefficient: 0.2, nozzleLossCoefficient: 0.02 };

test('jet performance, lossless: the worked values at 0 and 20 m/s', async () => {
  const { res, body } = await post('/api/v1/jet-performance', {
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0, 20],
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  const [rest, at20] = body.data.points;
  // Default water: fresh at 15 C, 999.1026 kg/m^3 (ITTC Recommended Procedure 7.5-02-01-03).
  assertClose(body.data.densityKgM3, 999.1026, 1e-4, 'default density');
  // Worked check values, momentum theory per Allison 1993 / MIT 2.611, computed independently (4 and 2 decimals given).
  assertClose(rest.speedMs, 0, 0, 'speed');
  assertClose(rest.jetVelocityMs, 42.4441, 5e-4, 'v_j at V = 0');
  assertClose(rest.thrustN, 14136.25, 0.01, 'T at V = 0');
  assertClose(at20.jetVelocityMs, 45.5802, 5e-4, 'v_j at V = 20 m/s');
  assertClose(at20.thrustN, 9149.11, 0.01, 'T at V = 20 m/s');
  // Lossless identity T = 2P/(v_j + V) (momentum theory, Allison 1993), on the API's own v_j.
  assertClose(at20.thrustN, (2 * 300_000) / (at20.jetVelocityMs + 20), 1e-6 * at20.thrustN, 'T = 2P/(v_j + V)');
  // Definition m_dot = rho A v_j with A = pi D^2 / 4 (mass flow through the nozzle exit).
  assertClose(
    rest.massFlowKgS,
    ((999.1026 * (Math.PI * 0.1 ** 2)) / 4) * rest.jetVelocityMs,
    1e-6 * rest.massFlowKgS,
    'm_dot = rho A v_j',
  );
});

test('jet performance with losses (eta 0.9, K_i 0.2, K_n 0.02): the worked values', async () => {
  const { res, body } = await post('/api/v1/jet-performance', {
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0, 20],
    ...LOSSES,
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  const [rest, at20] = body.data.points;
  // Worked check values, momentum theory per Allison 1993 / MIT 2.611 loss form, computed independently.
  assertClose(rest.jetVelocityMs, 40.7097, 5e-4, 'v_j at V = 0');
  assertClose(rest.thrustN, 13004.56, 0.01, 'T at V = 0');
  assertClose(at20.thrustN, 7903.79, 0.01, 'T at V = 20 m/s');
});

test('jet performance water: sea water at 20 C uses the ITTC density; densityKgM3 wins over water', async () => {
  const sea = await post('/api/v1/jet-performance', {
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    water: { kind: 'sea', temperatureC: 20 },
  });
  assert.equal(sea.res.status, 200, JSON.stringify(sea.body));
  // Sea water, absolute salinity 35.16504 g/kg, 20 C (ITTC Recommended Procedure 7.5-02-01-03 table).
  assertClose(sea.body.data.densityKgM3, 1024.8103, 1e-4, 'sea water at 20 C');

  const override = await post('/api/v1/jet-performance', {
    powerKw: 300,
    nozzleDiameterMm: 100,
    speedsMs: [0],
    water: { kind: 'sea', temperatureC: 20 },
    densityKgM3: 999.1026,
  });
  assert.equal(override.res.status, 200, JSON.stringify(override.body));
  assertClose(override.body.data.densityKgM3, 999.1026, 0, 'the given density is used');
  // With fresh-water density the lossless worked value returns (Allison 1993 / MIT 2.611).
  assertClose(override.body.data.points[0].thrustN, 14136.25, 0.01, 'T at V = 0 with the density override');
});

test('crossover: 100 mm against 90 mm cross at 33.49 m/s with losses and never without', async () => {
  const lossy = await post('/api/v1/jet-performance/crossover', {
    powerKw: 300,
    nozzleDiametersMm: [100, 90],
    ...LOSSES,
  });
  assert.equal(lossy.res.status, 200, JSON.stringify(lossy.body));
  // Curves cross at V = 33.49 m/s (2 decimals given): momentum theory with the MIT 2.611 loss form, found by bisection
  // outside this project's code.
  assertClose(lossy.body.data.crossoverSpeedMs, 33.49, 0.006, 'crossover speed');

  const lossless = await post('/api/v1/jet-performance/crossover', { powerKw: 300, nozzleDiametersMm: [100, 90] });
  assert.equal(lossless.res.status, 200, JSON.stringify(lossless.body));
  // Lossless, the larger nozzle always has more thrust, so there is no crossover (T = 2P/(v_j + V), Allison 1993).
  assert.equal(lossless.body.data.crossoverSpeedMs, null);
});

test('conformity: the four worked decisions at limit 102.00 mm, U 0.05 mm under each rule', async () => {
  // Worked decisions read off ILAC-G8:09/2019 (simple and guarded acceptance) and
  // ISO 14253-1:2017 (proven / not proven / undecided), mapped to the API's verdict names.
  const table = [
    { measuredMm: 101.93, simple: 'conforms', guarded: 'conforms', iso14253: 'conforms' },
    { measuredMm: 101.97, simple: 'conforms', guarded: 'does_not_conform', iso14253: 'inconclusive' },
    { measuredMm: 102.02, simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'inconclusive' },
    { measuredMm: 102.06, simple: 'does_not_conform', guarded: 'does_not_conform', iso14253: 'does_not_conform' },
  ] as const;
  for (const row of table) {
    for (const rule of ['simple', 'guarded', 'iso14253'] as const) {
      // Smaller readings beside the decisive one: against a maximum the largest local size counts (ISO 14405-1:2016).
      const readingsMm = [101.5, row.measuredMm, 101.6];
      const { res, body } = await post('/api/v1/conformity', {
        readingsMm,
        maxMm: 102.0,
        expandedUncertaintyMm: 0.05,
        rule,
      });
      assert.equal(res.status, 200, JSON.stringify(body));
      assert.equal(body.data.verdict, row[rule], `${row.measuredMm} mm under ${rule}`);
      assert.equal(body.data.decisiveValueMm, row.measuredMm, 'the largest reading decides');
      assert.match(
        body.data.explanation,
        new RegExp(row.measuredMm.toFixed(2).replace('.', '\\.')),
        'the explanation names the reading',
      );
    }
  }
});

test('conformity with burdenOfProof: the worked decisions resolved for whoever must prove; without it the answer is unchanged', async () => {
  // ISO 14253-1:2017, clause 5 (the supplier proves conformity, the customer proves non-conformity;
  // the uncertainty counts against whoever proves) [memory for the clause number]; ILAC-G8:09/2019.
  // Upper limit 102.00 mm, U 0.05 mm; 101.97 and 102.02 lie in the zone of doubt.
  const table = [
    { measuredMm: 101.93, conformity: 'conforms', non_conformity: 'conforms' },
    { measuredMm: 101.97, conformity: 'not_accepted', non_conformity: 'non_conformity_not_proven' },
    { measuredMm: 102.02, conformity: 'not_accepted', non_conformity: 'non_conformity_not_proven' },
    { measuredMm: 102.06, conformity: 'does_not_conform', non_conformity: 'does_not_conform' },
  ] as const;
  for (const row of table) {
    const body = { readingsMm: [101.5, row.measuredMm], maxMm: 102.0, expandedUncertaintyMm: 0.05, rule: 'iso14253' };
    const plainRes = await fetch(`${BASE_URL}/api/v1/conformity`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': clientAddress() },
      body: JSON.stringify(body),
    });
    assert.equal(plainRes.status, 200);
    const plainText = await plainRes.text();
    const plain = JSON.parse(plainText);
    assert.equal('outcome' in plain.data, false, 'no outcome without burdenOfProof');
    for (const burden of ['conformity', 'non_conformity'] as const) {
      const { res, body: answer } = await post('/api/v1/conformity', { ...body, burdenOfProof: burden });
      assert.equal(res.status, 200, JSON.stringify(answer));
      assert.equal(answer.data.outcome.outcome, row[burden], `${row.measuredMm} mm, ${burden}`);
      assert.equal(answer.data.outcome.burdenOfProof, burden);
      assert.equal(typeof answer.data.outcome.explanation, 'string');
      // The old fields, byte for byte: the answer without outcome serialises to the answer given without the field.
      const { outcome: _outcome, ...oldFields } = answer.data;
      assert.equal(
        JSON.stringify({ data: oldFields }),
        plainText,
        `${row.measuredMm} mm, ${burden}: old fields unchanged`,
      );
    }
  }
  const { res, body: refused } = await post('/api/v1/conformity', {
    readingsMm: [101.97],
    maxMm: 102,
    expandedUncertaintyMm: 0.05,
    rule: 'iso14253',
    burdenOfProof: 'entrant',
  });
  assert.equal(res.status, 400);
  assert.equal(refused.error.code, 'invalid_input');
  assert.deepEqual(
    refused.error.details.map((d: { field: string }) => d.field),
    ['burdenOfProof'],
  );
  assert.match(refused.error.details[0].message, /conformity.*non_conformity/);
});

test('bad bodies get 400 with the field named in details, never a 500', async () => {
  const jet = { powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0, 20] };
  const cases: { what: string; path: string; body: unknown; field: string }[] = [
    {
      what: 'missing power',
      path: '/api/v1/jet-performance',
      body: { nozzleDiameterMm: 100, speedsMs: [0] },
      field: 'powerKw',
    },
    {
      what: 'string for a number',
      path: '/api/v1/jet-performance',
      body: { ...jet, powerKw: '300' },
      field: 'powerKw',
    },
    { what: 'negative power', path: '/api/v1/jet-performance', body: { ...jet, powerKw: -300 }, field: 'powerKw' },
    {
      what: 'efficiency 1.5',
      path: '/api/v1/jet-performance',
      body: { ...jet, pumpEfficiency: 1.5 },
      field: 'pumpEfficiency',
    },
    {
      what: 'temperature outside the ITTC table',
      path: '/api/v1/jet-performance',
      body: { ...jet, water: { kind: 'fresh', temperatureC: 30 } },
      field: 'water.temperatureC',
    },
    {
      what: 'one nozzle for a crossover',
      path: '/api/v1/jet-performance/crossover',
      body: { powerKw: 300, nozzleDiametersMm: [100] },
      field: 'nozzleDiametersMm',
    },
    {
      what: 'negative second nozzle',
      path: '/api/v1/jet-performance/crossover',
      body: { powerKw: 300, nozzleDiametersMm: [100, -90] },
      field: 'nozzleDiametersMm.1',
    },
    {
      what: 'empty readings',
      path: '/api/v1/conformity',
      body: { readingsMm: [], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'simple' },
      field: 'readingsMm',
    },
    {
      what: 'unknown rule',
      path: '/api/v1/conformity',
      body: { readingsMm: [101.9], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'lenient' },
      field: 'rule',
    },
    {
      what: 'no limit at all',
      path: '/api/v1/conformity',
      body: { readingsMm: [101.9], expandedUncertaintyMm: 0.05, rule: 'simple' },
      field: 'maxMm',
    },
  ];
  for (const c of cases) {
    const { res, body } = await post(c.path, c.body);
    assert.equal(res.status, 400, `${c.what}: ${JSON.stringify(body)}`);
    assert.equal(body.error.code, 'invalid_input', c.what);
    assert.equal(typeof body.error.message, 'string', c.what);
    const detail = body.error.details.find((d: { field: string }) => d.field === c.field);
    assert.ok(detail, `${c.what}: details name ${c.field}: ${JSON.stringify(body.error.details)}`);
    assert.ok(detail.message.length > 5, `${c.what}: a readable message`);
  }
});

test('not JSON -> 400, wrong content type -> 415, over 64 KB -> 413; a body just under the cap is read', async () => {
  const notJson = await post('/api/v1/jet-performance', '{"powerKw": 300,');
  assert.equal(notJson.res.status, 400);
  assert.equal(notJson.body.error.code, 'invalid_json');

  const wrongType = await post('/api/v1/conformity', 'readingsMm=101.9', { 'content-type': 'text/plain' });
  assert.equal(wrongType.res.status, 415);
  assert.equal(wrongType.body.error.code, 'unsupported_media_type');

  const pad = (bytes: number) =>
    JSON.stringify({ powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0], padding: 'x'.repeat(bytes) });
  const tooLarge = await post('/api/v1/jet-performance', pad(70 * 1024));
  assert.equal(tooLarge.res.status, 413);
  assert.equal(tooLarge.body.error.code, 'too_large');

  // 60 KB passes the size check and reaches the schema, which refuses the unknown key.
  const underCap = await post('/api/v1/jet-performance', pad(60 * 1024));
  assert.equal(underCap.res.status, 400, JSON.stringify(underCap.body).slice(0, 300));
  assert.equal(underCap.body.error.code, 'invalid_input');
});

type Schema = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

/** Checks a value against the subset of JSON Schema the document uses ($ref, type, required, properties, items, anyOf, enum). */
function assertFitsSchema(value: unknown, schema: Schema, components: Record<string, Schema>, at: string) {
  if (schema.$ref) return assertFitsSchema(value, components[String(schema.$ref).split('/').pop()!], components, at);
  if (schema.anyOf) {
    const fits = schema.anyOf.some((s: Schema) => {
      try {
        assertFitsSchema(value, s, components, at);
        return true;
      } catch {
        return false;
      }
    });
    assert.ok(fits, `${at}: fits one of anyOf`);
    return;
  }
  if (schema.enum) assert.ok(schema.enum.includes(value), `${at}: ${String(value)} in enum`);
  const type = schema.type;
  if (type === 'null') assert.equal(value, null, at);
  if (type === 'number' || type === 'integer') assert.equal(typeof value, 'number', at);
  if (type === 'string') assert.equal(typeof value, 'string', at);
  if (type === 'boolean') assert.equal(typeof value, 'boolean', at);
  if (type === 'array') {
    assert.ok(Array.isArray(value), `${at} is an array`);
    (value as unknown[]).forEach(
      (v, i) => schema.items && assertFitsSchema(v, schema.items, components, `${at}[${i}]`),
    );
  }
  if (type === 'object') {
    assert.ok(value && typeof value === 'object', `${at} is an object`);
    for (const key of schema.required ?? []) assert.ok(key in (value as object), `${at}.${key} is present`);
    for (const [key, sub] of Object.entries(schema.properties ?? {})) {
      if (key in (value as object))
        assertFitsSchema((value as Record<string, unknown>)[key], sub as Schema, components, `${at}.${key}`);
    }
  }
}

test('OpenAPI document: version 3.1, the three operations, required numeric inputs, documented shapes match the answers', async () => {
  const res = await fetch(`${BASE_URL}/api/v1/openapi.json`, { headers: { 'x-forwarded-for': clientAddress() } });
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-type') ?? '', /application\/json/);
  const doc = JSON.parse(await res.text());
  assert.match(doc.openapi, /^3\.1\.\d+$/);
  const schemas: Record<string, Schema> = doc.components.schemas;
  const requestSchema = (path: string) => {
    const op = doc.paths[path]?.post;
    assert.ok(op, `POST ${path} is listed`);
    assert.equal(op.requestBody.required, true);
    for (const status of ['200', '400', '413', '415', '429'])
      assert.ok(op.responses[status], `${path} documents ${status}`);
    assert.ok(op.responses['429'].headers['Retry-After'], `${path} documents Retry-After`);
    assert.equal(op.responses['400'].content['application/json'].schema.$ref, '#/components/schemas/ErrorBody');
    return schemas[op.requestBody.content['application/json'].schema.$ref.split('/').pop()];
  };

  const jet = requestSchema('/api/v1/jet-performance');
  assert.deepEqual([...jet.required].sort(), ['nozzleDiameterMm', 'powerKw', 'speedsMs']);
  assert.equal(jet.properties.powerKw.type, 'number');
  assert.equal(jet.properties.powerKw.exclusiveMinimum, 0, 'power must be above 0');
  assert.equal(jet.properties.pumpEfficiency.maximum, 1);
  assert.equal(jet.additionalProperties, false, 'unknown keys are refused');
  const crossover = requestSchema('/api/v1/jet-performance/crossover');
  assert.deepEqual([...crossover.required].sort(), ['nozzleDiametersMm', 'powerKw']);
  assert.equal(crossover.properties.nozzleDiametersMm.prefixItems.length, 2);
  const conformity = requestSchema('/api/v1/conformity');
  assert.deepEqual([...conformity.required].sort(), ['expandedUncertaintyMm', 'readingsMm', 'rule']);
  assert.deepEqual([...conformity.properties.rule.enum].sort(), ['guarded', 'iso14253', 'simple']);
  assert.deepEqual([...conformity.properties.burdenOfProof.enum].sort(), ['conformity', 'non_conformity']);

  const error = schemas.ErrorBody;
  assert.deepEqual(error.required, ['error']);
  assert.deepEqual([...error.properties.error.required].sort(), ['code', 'message']);
  assert.ok(error.properties.error.properties.details, 'details are documented');

  // The live answers fit the documented success and error shapes.
  const answers = [
    { path: '/api/v1/jet-performance', body: { powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0, 20] } },
    { path: '/api/v1/jet-performance/crossover', body: { powerKw: 300, nozzleDiametersMm: [100, 90], ...LOSSES } },
    {
      path: '/api/v1/conformity',
      body: { readingsMm: [101.97], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'iso14253' },
    },
    {
      path: '/api/v1/conformity',
      body: {
        readingsMm: [101.97],
        maxMm: 102,
        expandedUncertaintyMm: 0.05,
        rule: 'iso14253',
        burdenOfProof: 'conformity',
      },
    },
    { path: '/api/v1/conformity', body: { readingsMm: [], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'iso14253' } },
  ];
  for (const a of answers) {
    const { res: r, body } = await post(a.path, a.body);
    const response = doc.paths[a.path].post.responses[String(r.status)];
    assert.ok(response, `${a.path} answered a documented status (${r.status})`);
    assertFitsSchema(body, response.content['application/json'].schema, schemas, `${a.path} ${r.status}`);
  }
});

test('rate limit: past the per-minute limit a client gets 429 with Retry-After; other clients carry on', async () => {
  // The real configured limit (scripts/test.sh sets it; 600 is the documented default in .env.example).
  const limit = Number(process.env.PUBLIC_API_RATE_LIMIT_PER_MINUTE ?? 600);
  // No proxy declared (TRUSTED_PROXY_HOPS=0, as on one machine): the client is the socket's address.
  const address = randomLoopback();
  const body = JSON.stringify({ readingsMm: [101.93], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'simple' });
  const send = (path: string, payload: string, headers: Record<string, string> = {}, from = address) =>
    fromAddress(from, path, {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...headers },
      body: payload,
    });

  const first = await send('/api/v1/conformity', body);
  assert.equal(first.status, 200);
  const rows = await query<{ key: string; attempts: number }>(
    'select key, attempts from auth_throttles where key = $1',
    [`rate:public-api:${address}`],
  );
  assert.equal(rows.length, 1, 'one counter for this client, kept in PostgreSQL (so it holds across app servers)');
  assert.equal(rows[0].attempts, 1);

  // As if this client had sent limit - 1 requests this minute: the next is the last one allowed.
  await query('update auth_throttles set attempts = $2, window_started_at = now() where key = $1', [
    rows[0].key,
    limit - 1,
  ]);
  const last = await send('/api/v1/conformity', body);
  assert.equal(last.status, 200, 'the limit itself is allowed');

  const over = await send(
    '/api/v1/jet-performance',
    JSON.stringify({ powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0] }),
  );
  assert.equal(over.status, 429, over.body);
  const overBody = JSON.parse(over.body);
  assert.equal(overBody.error.code, 'rate_limited');
  const retryAfter = Number(over.headers['retry-after']);
  assert.ok(
    Number.isInteger(retryAfter) && retryAfter >= 1 && retryAfter <= 60,
    `Retry-After within the one-minute window: ${retryAfter}`,
  );
  assert.equal(overBody.error.details.retryAfterS, retryAfter);

  const openapi = await fromAddress(address, '/api/v1/openapi.json');
  assert.equal(openapi.status, 429, 'every public route shares the bucket');

  // A forged X-Forwarded-For does not buy a fresh bucket.
  const forged = await send('/api/v1/conformity', body, { 'x-forwarded-for': clientAddress() });
  assert.equal(forged.status, 429, 'a forged X-Forwarded-For is not the client');

  const other = await send('/api/v1/conformity', body, {}, randomLoopback());
  assert.equal(other.status, 200, 'another client is not limited');
});
