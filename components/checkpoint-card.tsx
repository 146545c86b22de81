import Link from '@/components/link';
import { checkpointLines } from '@/lib/core/chain/checkpoint-lines';
import type { Checkpoint } from '@/lib/core/chain/bundle-format';

/** The signed record checkpoint printed under a published page (parity report, results), as on its PDF. */
export function CheckpointCard({
  checkpoint,
  timeZone,
  testId,
  headingId,
}: {
  checkpoint: Checkpoint;
  timeZone: string;
  testId: string;
  headingId: string;
}) {
  return (
    <section className="card space-y-1" aria-labelledby={headingId} data-testid={testId}>
      <h2 id={headingId} className="text-xl">
        Record checkpoint
      </h2>
      {checkpointLines(checkpoint, timeZone).map((line, k) => (
        <p
          key={k}
          className={/^[0-9a-f]{64}$|^[A-Za-z0-9+/=]{80,}$/.test(line) ? 'break-all font-mono text-sm' : 'text-sm'}
        >
          {line.includes('/verify page') ? (
            <>
              Check a copy of the meeting&apos;s records against these lines with its export bundle:{' '}
              <code>npm run verify -- &lt;bundle&gt;</code>, or <Link href="/verify">verify a bundle here</Link>.
            </>
          ) : (
            line
          )}
        </p>
      ))}
    </section>
  );
}
