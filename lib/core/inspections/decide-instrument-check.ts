import { AppError } from '@/lib/core/errors';

/**
 * The check's outcome. With an error limit (the instrument's maximum permissible error) on record the
 * server decides: passed when the reading lies within the limit of the reference's nominal value
 * (JCGM 200:2012, VIM 4.26, maximum permissible measurement error; ISO 14253-1:2017 compares an
 * instrument's indication error with its MPE in the same way, here without a guard band). A "passed"
 * the figures contradict is refused, naming both; a "failed" always stands (the official may fail an
 * instrument for what the figures do not show). Without a limit, only the person checking
 * can say, and must.
 */
export function decideInstrumentCheck(
  input: { nominalValue: number; reading: number; passed?: boolean },
  instrument: { errorLimit: number | null; quantity: 'length' | 'mass' },
): boolean {
  const unit = instrument.quantity === 'mass' ? 'kg' : 'mm';
  if (instrument.errorLimit == null) {
    if (input.passed === undefined) {
      const message = 'This instrument has no error limit on record: say whether the check passed.';
      throw new AppError('invalid_input', 400, `passed: ${message}`, [{ field: 'passed', message }]);
    }
    return input.passed;
  }
  const off = Math.abs(input.reading - input.nominalValue);
  // A margin of a millionth of the limit: 100.02 against 100 with a 0.02 limit is within it, as written.
  const decided = off <= instrument.errorLimit * (1 + 1e-6);
  // Failing an instrument is always the official's to do (a cracked jaw, a sticky slide: the figures are
  // not all there is); passing one the figures fail is not.
  if (input.passed === false) return false;
  if (input.passed === true && !decided) {
    const message = `The reading is ${fmt(off)} ${unit} off the reference, beyond the instrument’s error limit of ±${fmt(instrument.errorLimit)} ${unit}: the check fails. Check the figures, or record it as failed.`;
    throw new AppError('invalid_input', 400, `passed: ${message}`, [{ field: 'passed', message }]);
  }
  return decided;
}

const fmt = (x: number) => String(Number(x.toPrecision(6)));
