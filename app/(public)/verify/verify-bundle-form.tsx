'use client';

import { useState } from 'react';
import { verifyBundle, type VerifyResult } from '@/lib/core/chain/verify-bundle';

/** Reads the chosen bundle with FileReader and verifies it here; nothing leaves the browser. */
export function VerifyBundleForm() {
  const [result, setResult] = useState<VerifyResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [text, setText] = useState<string | null>(null);
  const [fingerprint, setFingerprint] = useState('');

  function check(bundle: string, expected: string) {
    setBusy(true);
    setError(null);
    verifyBundle(bundle, { expectedFingerprint: expected.trim() || null })
      .then(setResult)
      .catch((err: Error) => setError(`The bundle could not be checked here: ${err.message}`))
      .finally(() => setBusy(false));
  }

  function onFile(file: File | undefined) {
    setResult(null);
    setError(null);
    setText(null);
    if (!file) return;
    setBusy(true);
    const reader = new FileReader();
    reader.onerror = () => {
      setBusy(false);
      setError('The file could not be read.');
    };
    reader.onload = () => {
      const bundle = String(reader.result);
      setText(bundle);
      check(bundle, fingerprint);
    };
    reader.readAsText(file);
  }

  function onFingerprint(value: string) {
    setFingerprint(value);
    if (text !== null) check(text, value);
  }

  return (
    <div className="space-y-4">
      <div className="space-y-1">
        <label htmlFor="fingerprint" className="field-label">
          Key fingerprint printed on the meeting&apos;s published page (recommended)
        </label>
        <input
          id="fingerprint"
          type="text"
          inputMode="text"
          autoComplete="off"
          spellCheck={false}
          className="field-input font-mono"
          value={fingerprint}
          onChange={(e) => onFingerprint(e.target.value)}
          aria-describedby="fingerprint-help"
        />
        <p id="fingerprint-help" className="text-sm text-ink-soft">
          A bundle carries its own key, so without the published fingerprint it only shows that it is consistent with
          itself: anyone who rewrote the records could sign them again with a key of their own.
        </p>
      </div>
      <div className="space-y-1">
        <label htmlFor="bundle" className="field-label">
          Export bundle
        </label>
        <input
          id="bundle"
          type="file"
          accept=".jsonl,application/x-ndjson,text/plain"
          onChange={(e) => onFile(e.target.files?.[0])}
          disabled={busy}
        />
      </div>
      {busy && <p role="status">Checking…</p>}
      {error && <p role="alert">{error}</p>}
      {result?.ok === true && (
        <div role="status" className="card space-y-1" data-testid="verify-result">
          <p className="font-semibold">
            Verified: {result.records} records ({result.withheld} withheld), {result.files} files,{' '}
            {result.checkpoints.length} signed checkpoints.
          </p>
          <p className="text-sm">
            {fingerprint.trim()
              ? 'Signed with the published key:'
              : 'Compare the key’s fingerprint with the one printed on the meeting’s published pages:'}
          </p>
          <p className="break-all font-mono text-sm">{result.fingerprint}</p>
        </div>
      )}
      {result?.ok === false && (
        <div role="alert" className="card space-y-1 border-2 border-red-700" data-testid="verify-result">
          <p className="font-semibold">Not verified: {result.problem.message}.</p>
          {result.problem.record && (
            <p className="text-sm">
              First record that differs: number {result.problem.record.seq}, {result.problem.record.table}{' '}
              {result.problem.record.rowId} (line {result.problem.line} of the file).
            </p>
          )}
        </div>
      )}
    </div>
  );
}
