// What a verdict feels and sounds like at the dock, for a scrutineer whose eyes are on the boat: a different
// number of pulses for each overall result (one for conforms, two for inconclusive, three for does not conform),
// so they tell apart by count without judging length or pitch, and the sound follows the same count. The words are
// always on the screen as well (never vibration, sound or colour alone). Plain data and functions: unit-tested.
export type SignalledVerdict = 'conforms' | 'inconclusive' | 'does_not_conform';

/** Vibration API pattern: on, off, on... in ms. Tones: one per pulse, with the pause after it. */
export type VerdictSignal = {
  vibrateMs: number[];
  tones: { hz: number; ms: number; gapMs: number }[];
};

export const VERDICT_SIGNALS: Record<SignalledVerdict, VerdictSignal> = {
  conforms: { vibrateMs: [120], tones: [{ hz: 880, ms: 160, gapMs: 0 }] },
  inconclusive: {
    vibrateMs: [120, 140, 120],
    tones: [
      { hz: 523, ms: 140, gapMs: 140 },
      { hz: 523, ms: 140, gapMs: 0 },
    ],
  },
  does_not_conform: {
    vibrateMs: [350, 150, 350, 150, 350],
    tones: [
      { hz: 220, ms: 300, gapMs: 150 },
      { hz: 220, ms: 300, gapMs: 150 },
      { hz: 220, ms: 300, gapMs: 0 },
    ],
  },
};

/** The signal for an overall result; none for anything else (a record still pending: nothing decided yet). */
export function signalFor(overall: string): VerdictSignal | null {
  return Object.hasOwn(VERDICT_SIGNALS, overall) ? VERDICT_SIGNALS[overall as SignalledVerdict] : null;
}

/** Pulses in a vibration pattern (the odd positions are pauses). */
export const pulseCount = (pattern: readonly number[]) => Math.ceil(pattern.length / 2);

export const SOUND_SETTING = 'boreline-verdict-sound';

/** Plays the signal's tones on the phone (Web Audio API): no sound file to fetch, nothing to cache. */
export async function playTones(signal: VerdictSignal): Promise<void> {
  const Ctx = window.AudioContext;
  if (!Ctx) return;
  const ctx = new Ctx();
  let t = ctx.currentTime + 0.02;
  for (const tone of signal.tones) {
    const osc = ctx.createOscillator();
    const gain = ctx.createGain();
    osc.frequency.value = tone.hz;
    osc.type = 'sine';
    // A short rise and fall: a click-free tone.
    gain.gain.setValueAtTime(0, t);
    gain.gain.linearRampToValueAtTime(0.3, t + 0.01);
    gain.gain.setValueAtTime(0.3, t + tone.ms / 1000 - 0.02);
    gain.gain.linearRampToValueAtTime(0, t + tone.ms / 1000);
    osc.connect(gain).connect(ctx.destination);
    osc.start(t);
    osc.stop(t + tone.ms / 1000);
    t += (tone.ms + tone.gapMs) / 1000;
  }
  window.setTimeout(() => void ctx.close().catch(() => undefined), (t - ctx.currentTime) * 1000 + 200);
}
