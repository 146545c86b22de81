'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { useParams } from 'next/navigation';
import { requestJson } from '@/components/forms/request-json';
import { FieldError } from '@/components/forms/form-message';
import { COMPONENT_KIND_LABELS } from '@/lib/core/inputs/component-kinds';
import type { SerialMatch } from '@/lib/server/components/find-boat-by-serial';

/** How long a paused camera is kept for the next boat before it is let go. */
const CAMERA_IDLE_MS = 2 * 60_000;
/** Html5QrcodeScannerState.SCANNING (html5-qrcode's state-manager), without importing the library up front. */
const SCANNING = 2;

/** html5-qrcode's own file scan (its bundled ZXing decoder). */
async function decodeWithHtml5Qrcode(file: File): Promise<string | null> {
  const { Html5Qrcode } = await import('html5-qrcode');
  const reader = new Html5Qrcode('dock-file-scan', { verbose: false });
  try {
    return await reader.scanFile(file, false);
  } catch {
    return null;
  } finally {
    reader.clear();
  }
}

/**
 * A second decoder for the photo. Measured here: html5-qrcode's scanFile missed 3 and 4 of 40
 * clean, printed-size tag codes (level Q) that jsQR read every time, so a miss gets a second try.
 * Large phone photos are scaled to at most 1600 px on the long side first (speed; jsQR needs no more).
 */
async function decodeWithJsQr(file: File): Promise<string | null> {
  try {
    const [{ default: jsQR }, bitmap] = await Promise.all([import('jsqr'), createImageBitmap(file)]);
    const scale = Math.min(1, 1600 / Math.max(bitmap.width, bitmap.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(bitmap.width * scale);
    canvas.height = Math.round(bitmap.height * scale);
    const ctx = canvas.getContext('2d', { willReadFrequently: true });
    if (!ctx) return null;
    ctx.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
    const { data, width, height } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    return jsQR(data, width, height, { inversionAttempts: 'attemptBoth' })?.data ?? null;
  } catch {
    return null;
  }
}

export type FindQuery = { kind: 'scan'; text: string } | { kind: 'typed'; text: string };
type Props = { onFind: (q: FindQuery) => void; isBusy: boolean };

/**
 * The fourth way: a serial number read off an engine, pump or impeller (a boat whose tag is gone and
 * whose number is not painted yet). Needs a signal: the server looks among the boats entered here and
 * says which component matched; the boat card then opens by its race number.
 */
function FindBySerial({ onFind, isBusy }: Props) {
  const { eventId } = useParams<{ eventId: string }>();
  const [serial, setSerial] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [matches, setMatches] = useState<SerialMatch[]>([]);
  const [isLooking, setLooking] = useState(false);
  const describe = (m: SerialMatch) =>
    `${COMPONENT_KIND_LABELS[m.kind]}${m.maker || m.model ? ` (${[m.maker, m.model].filter(Boolean).join(' ')})` : ''} serial ${m.serialNumber} is on no. ${m.raceNumber} ${m.boatName}${m.entryStatus === 'withdrawn' ? ' (withdrawn)' : ''}`;

  async function look() {
    setError(null);
    setMatches([]);
    if (!serial.trim()) return setError('Type the serial number as stamped on the part.');
    setLooking(true);
    const answer = await requestJson<{ matches: SerialMatch[] }>(
      `/api/events/${eventId}/component-serials/${encodeURIComponent(serial.trim())}`,
      { method: 'GET', cache: 'no-store' },
    );
    setLooking(false);
    if (!answer.ok) return setError(answer.fieldErrors.serial ?? answer.message);
    setMatches(answer.data.matches);
    if (answer.data.matches.length === 1 && !answer.data.matches[0].isDisputed)
      onFind({ kind: 'typed', text: String(answer.data.matches[0].raceNumber) });
  }

  return (
    <form
      className="space-y-2"
      noValidate
      aria-label="Find by component serial"
      onSubmit={(e) => {
        e.preventDefault();
        void look();
      }}
    >
      <div className="grid gap-3 sm:grid-cols-[1fr_auto] sm:items-end">
        <div className="min-w-0">
          <label htmlFor="find-serial" className="field-label text-lg">
            Engine, pump or impeller serial
          </label>
          <input
            id="find-serial"
            className="field-input min-h-touch text-xl"
            autoComplete="off"
            autoCapitalize="characters"
            value={serial}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? 'find-serial-error' : undefined}
            onChange={(e) => setSerial(e.target.value)}
          />
        </div>
        <button type="submit" className="btn-secondary min-h-touch text-xl" disabled={isBusy || isLooking}>
          {isLooking ? 'Looking…' : 'Find by serial'}
        </button>
      </div>
      <FieldError id="find-serial-error" name="serial" error={error ?? undefined} className="text-lg" />
      {matches.length > 0 && (
        <ul role="status" aria-live="polite" className="space-y-2" data-testid="serial-matches">
          {matches.map((m) => (
            <li
              key={m.componentId}
              className="flex flex-wrap items-center justify-between gap-2 rounded-lg bg-tide-50 p-3"
            >
              <span className="font-bold text-tide-700">
                {describe(m)}
                {m.isDisputed && (
                  <span className="mt-1 block font-normal text-doubt-800" data-testid="serial-disputed">
                    The same part is declared on another boat here: two owners claim it. The chief scrutineer decides
                    who holds it; check the plate and the seals.
                  </span>
                )}
              </span>
              {(matches.length > 1 || m.isDisputed) && (
                <button
                  type="button"
                  className="btn-secondary min-h-touch"
                  disabled={isBusy}
                  onClick={() => onFind({ kind: 'typed', text: String(m.raceNumber) })}
                >
                  Open no. {m.raceNumber}
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
    </form>
  );
}

/**
 * Three ways to find the boat: the camera, a photo of the tag (for a phone whose camera will not
 * focus, or a tag photographed earlier), or the race number / tag code typed from the boat.
 * html5-qrcode touches the DOM and the camera, so it is imported inside effects and handlers only.
 */
export function FindBoat({ onFind, isBusy }: Props) {
  const [isCameraOn, setCameraOn] = useState(false);
  const [cameraError, setCameraError] = useState<string | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [typed, setTyped] = useState('');
  // Race numbers are digits: the phone's number pad by default; a tag code (letters) on request.
  const [isTypingCode, setTypingCode] = useState(false);
  // The camera's callback always calls the latest onFind without restarting the camera.
  const latestOnFind = useRef(onFind);
  useEffect(() => {
    latestOnFind.current = onFind;
  });
  const camera = useRef<{ scanner: import('html5-qrcode').Html5Qrcode; started: Promise<unknown> } | null>(null);
  const idleTimer = useRef<number | undefined>(undefined);

  // Stopping for real lets go of the camera: the next start asks the browser for it again (a browser that
  // grants the camera for one use only prompts again then). So between boats the scanner is paused, keeping
  // the camera it was given, and resumes at once with no second prompt; it is let go after CAMERA_IDLE_MS
  // unused (the stream costs battery) and when the dock screen closes.
  const stopCamera = useCallback(() => {
    window.clearTimeout(idleTimer.current);
    const c = camera.current;
    camera.current = null;
    if (c)
      void c.started
        .then(() => (c.scanner.isScanning ? c.scanner.stop() : undefined))
        .then(() => c.scanner.clear())
        .catch(() => undefined);
  }, []);
  useEffect(() => stopCamera, [stopCamera]);

  const pauseCamera = () => {
    setCameraOn(false);
    try {
      camera.current?.scanner.pause(true);
    } catch {
      stopCamera(); // not scanning yet: nothing to keep
    }
    window.clearTimeout(idleTimer.current);
    idleTimer.current = window.setTimeout(stopCamera, CAMERA_IDLE_MS);
  };

  async function startCamera() {
    window.clearTimeout(idleTimer.current);
    setCameraError(null);
    setCameraOn(true);
    const kept = camera.current;
    if (kept) {
      try {
        kept.scanner.resume(); // the camera already granted: no prompt
        return;
      } catch {
        stopCamera(); // not paused (it failed, or is still starting): start afresh
      }
    }
    const { Html5Qrcode } = await import('html5-qrcode');
    const scanner = new Html5Qrcode('dock-camera', { verbose: false });
    const started = scanner
      .start(
        { facingMode: 'environment' },
        { fps: 10, qrbox: { width: 240, height: 240 } },
        (text) => {
          if (camera.current?.scanner !== scanner || scanner.getState() !== SCANNING) return;
          pauseCamera();
          latestOnFind.current({ kind: 'scan', text });
        },
        () => undefined,
      )
      .catch(() => {
        if (camera.current?.scanner === scanner) camera.current = null;
        setCameraError(
          'The camera could not start. Allow the camera, use “Scan from a photo”, or type the race number.',
        );
        setCameraOn(false);
      });
    camera.current = { scanner, started };
  }

  async function scanPhoto(file: File | undefined) {
    if (!file) return;
    setFileError(null);
    const text = (await decodeWithHtml5Qrcode(file)) ?? (await decodeWithJsQr(file));
    if (text) onFind({ kind: 'scan', text });
    else setFileError('No tag code found in that photo. Take it square-on and close, or type the race number.');
  }

  return (
    <section aria-labelledby="find-heading" className="card space-y-4 text-lg">
      <h2 id="find-heading" className="text-2xl">
        Find the boat
      </h2>
      <div className="grid gap-3 sm:grid-cols-2">
        <button
          type="button"
          className="btn-primary min-h-[3.5rem] text-xl"
          onClick={() => (isCameraOn ? pauseCamera() : void startCamera())}
          disabled={isBusy}
          aria-pressed={isCameraOn}
        >
          {isCameraOn ? 'Stop the camera' : 'Scan tag'}
        </button>
        <label className="btn-secondary min-h-[3.5rem] cursor-pointer text-xl">
          Scan from a photo
          <input
            type="file"
            accept="image/*"
            capture="environment"
            className="sr-only"
            data-testid="scan-photo"
            aria-label="Scan from a photo"
            disabled={isBusy}
            onChange={(e) => {
              void scanPhoto(e.target.files?.[0]);
              e.target.value = '';
            }}
          />
        </label>
      </div>
      <div id="dock-camera" className={isCameraOn ? 'overflow-hidden rounded-lg' : 'hidden'} />
      <div id="dock-file-scan" className="hidden" aria-hidden="true" />
      {cameraError && (
        <p className="field-error text-lg" role="alert">
          {cameraError}
        </p>
      )}
      {fileError && (
        <p className="field-error text-lg" role="alert" data-testid="scan-photo-error">
          {fileError}
        </p>
      )}
      <form
        className="flex flex-wrap items-end gap-3"
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          if (typed.trim()) onFind({ kind: 'typed', text: typed });
        }}
      >
        <div className="min-w-0 flex-1">
          <label htmlFor="find-typed" className="field-label text-lg">
            Race number or tag code
          </label>
          <input
            id="find-typed"
            className="field-input min-h-touch text-xl"
            inputMode={isTypingCode ? 'text' : 'numeric'}
            pattern={isTypingCode ? undefined : '[0-9]*'}
            autoComplete="off"
            autoCapitalize="off"
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
          />
        </div>
        <button type="submit" className="btn-primary min-h-touch text-xl" disabled={isBusy}>
          Find
        </button>
        <button
          type="button"
          className="min-h-touch basis-full text-left text-base font-bold text-tide-700 underline"
          aria-pressed={isTypingCode}
          onClick={() => setTypingCode((on) => !on)}
        >
          {isTypingCode ? 'Type a race number instead' : 'Type a tag code instead'}
        </button>
      </form>
      <FindBySerial onFind={onFind} isBusy={isBusy} />
    </section>
  );
}
