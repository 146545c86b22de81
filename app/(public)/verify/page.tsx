// /verify: check a meeting's export bundle of its record chain in this browser. The file is read on the
// device and never uploaded: the same code as `npm run verify` (lib/core/chain/verify-bundle.ts).
import type { Metadata } from 'next';
import { VerifyBundleForm } from './verify-bundle-form';

export const metadata: Metadata = {
  title: 'Verify a record bundle',
  description: "Check a meeting's exported records against their hash chain and signed checkpoints, on this device.",
};

export default function VerifyPage() {
  return (
    <div className="space-y-6">
      <header className="space-y-3">
        <p className="text-sm font-bold uppercase tracking-widest text-flare-600">Record check</p>
        <h1>Verify a record bundle</h1>
        <p className="max-w-2xl text-lg text-ink-soft">
          Choose a meeting&apos;s export bundle (a <code>.jsonl</code> file). This page recomputes every record&apos;s
          hash and link, every file&apos;s SHA-256 and every checkpoint&apos;s signature, and names the first record
          where anything differs. The file stays on this device: nothing is uploaded.
        </p>
      </header>
      <VerifyBundleForm />
    </div>
  );
}
