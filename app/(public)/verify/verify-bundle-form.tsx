'use client';

import { useState } from 'react';
import { verifyBundle, type VerifyResult } from '@/lib/core/chain/verify-bundle';

/** Reads the chosen bundle with FileReader and verifies it here; nothing leaves the browser. */
export function VerifyBundleForm() {
  const [result, setResult] = useState<VerifyResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  function onFile(file: File | undefined) {
    setResult(null);
    setError(null);
    if (!file) return;
    setBusy(true);
    const reader = new FileReader();
    reader.onerror = () => {
      setBusy(false);
      setError('The file could not be read.');
    };
    reader.onload = () => {
      verifyBundle(String(reader.result))
        .then(setResult)
        .catch((err: Error) => setError(`The bundle could not be checked here: ${err.message}`))
        .finally(() => setBusy(false));
    };
    reader.readAsText(file);
  }

  return (
    <div className="space-y-4">
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
            Compare the key&apos;s fingerprint with the one printed on the meeting&apos;s published pages:
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
