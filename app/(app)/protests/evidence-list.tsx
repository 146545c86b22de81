import type { EvidenceView } from '@/lib/server/protests/list-evidence';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { IntegrityBadge } from './protest-badges';

/** Evidence in the order it was added, each file with its SHA-256 and a fresh integrity check. */
export function EvidenceList({ evidence, timeZone }: { evidence: EvidenceView[]; timeZone: string }) {
  if (evidence.length === 0) return <p className="text-ink-soft">No evidence yet.</p>;
  return (
    <ol className="space-y-3" data-testid="evidence-list">
      {evidence.map((e) => (
        <li key={e.id} className="rounded-lg border border-paper-line p-3" data-evidence-id={e.id} data-kind={e.kind}>
          <div className="flex flex-wrap items-center justify-between gap-2">
            {e.kind === 'file' ? (
              <a href={`/api/evidence/${e.id}`} className="font-bold">
                {e.fileName}
              </a>
            ) : (
              <span className="font-bold">{e.kind === 'note' ? 'Note' : 'Inspection record'}</span>
            )}
            {e.integrity && <IntegrityBadge integrity={e.integrity} />}
          </div>
          {e.kind === 'file' && (
            <p className="text-sm text-ink-soft">
              {e.contentType}, {(e.sizeBytes ?? 0).toLocaleString('en-GB')} bytes · SHA-256{' '}
              <code className="figure break-all" data-testid="evidence-sha256">
                {e.sha256}
              </code>
            </p>
          )}
          {e.kind === 'note' && <p className="whitespace-pre-wrap">{e.note}</p>}
          {e.kind === 'inspection_link' && <p>{e.inspectionLabel ?? e.inspectionId}</p>}
          <p className="text-sm text-ink-mute">
            Added by {e.addedByName}, {formatInZone(e.createdAt, timeZone)}
          </p>
        </li>
      ))}
    </ol>
  );
}
