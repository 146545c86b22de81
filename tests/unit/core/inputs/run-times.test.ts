import { test } from 'node:test';
import assert from 'node:assert/strict';
import { parseElapsedS, readRunTimesCsv, RunTimesFormInput } from '../../../../lib/core/inputs/run-times';

test('a timing CSV: units from the header, times in seconds or m:ss, every problem of a line named', () => {
  const lines = readRunTimesCsv(
    [
      'Race Number,Heat,Elapsed_s,Trap_Speed_mph,GPS_Top_Speed_kn,RPM,Conditions',
      '7,H1,41.25,70,60,6800,"calm, 18 °C"',
      '8,H1,1:02.5,,,,',
      'x,,abc,fast,,12.5,',
      '9,H1,40,,,',
    ].join('\r\n'),
  );
  assert.equal(lines.length, 4);
  const [a, b, c, d] = lines;
  assert.deepEqual(a.problems, []);
  // 1 mph = 0.44704 m/s and 1 kn = 1852/3600 m/s exactly (NIST SP 811, 2008, appendix B).
  assert.ok(Math.abs(a.row!.trapSpeedMs! - 70 * 0.44704) < 1e-12);
  assert.ok(Math.abs(a.row!.gpsTopSpeedMs! - (60 * 1852) / 3600) < 1e-12);
  assert.equal(a.row!.conditions, 'calm, 18 °C');
  assert.equal(b.row!.elapsedS, 62.5);
  assert.equal(c.row, null);
  assert.equal(c.line, 4);
  assert.match(c.problems.join(' '), /race number "x" is not a whole number/);
  assert.match(c.problems.join(' '), /elapsed time "abc"/);
  assert.match(c.problems.join(' '), /trap speed "fast" is not a number/);
  assert.match(d.problems.join(' '), /This line has 6 fields; the header has 7/);
});

test('file-level refusals name the fix', () => {
  assert.throws(
    () => readRunTimesCsv('race_number,elapsed_s\n1,40'),
    /"race_number", "run" \(or "heat"\) and "elapsed_s"/,
  );
  assert.throws(
    () => readRunTimesCsv('race_number,run,elapsed_s,trap_speed_furlongs\n1,1,40,3'),
    /does not say its unit/,
  );
  assert.throws(() => readRunTimesCsv('race_number,run,elapsed_s'), /at least one run/);
  assert.throws(() => readRunTimesCsv('race_number,run,elapsed_s\n"1,1,40'), /quoted field is not closed/);
});

test('a control character in a run name or conditions is refused for that line', () => {
  const [line] = readRunTimesCsv('race_number,run,elapsed_s,conditions\n1,1,40,wind\u202eeast');
  assert.equal(line.row, null);
  assert.match(line.problems[0], /control or text-direction character/);
});

test('elapsed times: seconds or minutes and seconds, nothing else', () => {
  assert.equal(parseElapsedS('41.237'), 41.237);
  assert.equal(parseElapsedS('1:02.5'), 62.5);
  assert.ok(Number.isNaN(parseElapsedS('1:75')));
  assert.ok(Number.isNaN(parseElapsedS('-3')));
  assert.ok(Number.isNaN(parseElapsedS('4e1')));
});

test('the hand-entry form: km/h made SI, a wrong speed named by the field typed', () => {
  const ok = RunTimesFormInput.parse({
    classId: '0b0e0000-0000-4000-8000-000000000101',
    courseLengthM: 400,
    rows: [{ raceNumber: 3, runLabel: '1', elapsedS: 40, trapSpeedKmh: 108 }],
  });
  assert.equal(ok.rows[0].trapSpeedMs, 30);
  assert.equal(ok.rows[0].gpsTopSpeedMs, null);
  const bad = RunTimesFormInput.safeParse({
    classId: '0b0e0000-0000-4000-8000-000000000101',
    courseLengthM: 400,
    rows: [{ raceNumber: 3, runLabel: '1', elapsedS: 40, trapSpeedKmh: 900 }],
  });
  assert.equal(bad.success, false);
  assert.deepEqual(bad.error!.issues[0].path, ['rows', 0, 'trapSpeedKmh']);
  assert.match(bad.error!.issues[0].message, /above 540 km\/h/);
});

test('the course is 10 m to 3000 m: a longer one is refused on the field (attack finding s7 F4: a 20 km course held the server)', () => {
  const body = (courseLengthM: number) => ({
    classId: '0b0e0000-0000-4000-8000-000000000101',
    courseLengthM,
    rows: [{ raceNumber: 3, runLabel: '1', elapsedS: 40 }],
  });
  assert.equal(RunTimesFormInput.safeParse(body(3000)).success, true);
  const long = RunTimesFormInput.safeParse(body(3001));
  assert.equal(long.success, false);
  assert.deepEqual(long.error!.issues[0].path, ['courseLengthM']);
  assert.match(long.error!.issues[0].message, /at most 3000 m/);
});
