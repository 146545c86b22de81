// Times on the phone's own clock (lib/core/format/device-time.ts). Reference: ECMA-402 (11th edition, 2024)
// §20.4.1 Date.prototype.toLocaleString and §20.4.3 toLocaleTimeString: each is defined as formatting with a
// new Intl.DateTimeFormat made from the same locales and options, so the cached formatter must give exactly
// what those calls give, in any time zone and language the runtime is set to.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { formatOnDevice } from '../../../../lib/core/format/device-time';

const cardOptions: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' };
const clockOptions: Intl.DateTimeFormatOptions = { hour: '2-digit', minute: '2-digit' };

test('the same text as toLocaleString / toLocaleTimeString with the same options (ECMA-402 §20.4.1, §20.4.3)', () => {
  for (const iso of ['2027-04-04T02:15:00Z', '2026-12-31T23:59:59.999Z', '2027-06-21T12:00:00+12:45']) {
    assert.equal(formatOnDevice(iso, cardOptions), new Date(iso).toLocaleString([], cardOptions));
    assert.equal(formatOnDevice(iso, clockOptions), new Date(iso).toLocaleTimeString([], clockOptions));
  }
});

test('the formatter kept for one set of options never leaks into another', () => {
  const iso = '2027-04-04T02:15:00Z';
  const first = formatOnDevice(iso, clockOptions);
  assert.equal(formatOnDevice(iso, cardOptions), new Date(iso).toLocaleString([], cardOptions));
  assert.equal(formatOnDevice(iso, clockOptions), first);
  assert.notEqual(formatOnDevice(iso, cardOptions), first, 'the card shows the day as well as the time');
});

test('takes a Date, an ISO string or epoch milliseconds for the same moment', () => {
  const ms = Date.UTC(2027, 3, 4, 2, 15);
  const want = formatOnDevice(ms, cardOptions);
  assert.equal(formatOnDevice(new Date(ms), cardOptions), want);
  assert.equal(formatOnDevice(new Date(ms).toISOString(), cardOptions), want);
});
