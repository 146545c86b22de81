'use client';

import { StatusBadge } from '@/components/status-badge';
import { VerdictBadge } from '@/components/verdict-badge';
import { INSPECTION_KIND_LABELS, type InspectionKind } from '@/lib/core/inputs/inspection-terms';
import { DECLARATION_STATUS_WORDS } from '@/lib/core/entries/check-declaration';
import type { InspectionView } from '@/lib/server/inspections/inspection-view';
import { formatFigure } from '@/lib/core/format/figures';
import { formatOnDevice } from '@/lib/core/format/device-time';
import { CHECK_AREA_LABELS } from '@/lib/core/inspections/check-areas';
import { describePowerEvidence } from '@/lib/core/inspections/power-evidence';
import { SEAL_ACTION_WORDS } from '@/lib/core/seals/seal-words';
import type { DockTarget } from './form-model';
import { useIsStarted } from './use-is-started';

/**
 * A time on the phone's own clock. The server does not know the phone's zone: a card that comes in the page's first
 * HTML (?race=, ?tag=) has the time filled in as the page starts, and a card drawn on the phone has it at once.
 */
function OnDevice({ iso }: { iso: string }) {
  return useIsStarted() ? formatOnDevice(iso, 'day-time') : '';
}

/** The boat at the dock: who it is, what was declared, what has been recorded here before. */
export function BoatCardView({
  target,
  onCorrect,
}: {
  target: DockTarget;
  onCorrect: (record: InspectionView) => void;
}) {
  const card = target.card;
  return (
    <section
      aria-labelledby="boat-heading"
      className="card space-y-3 text-lg"
      data-testid="boat-card"
      data-entry-id={target.entryId}
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="figure text-4xl font-bold" aria-label={`race number ${target.raceNumber}`}>
            {target.raceNumber}
          </p>
          <h2 id="boat-heading" className="text-2xl" data-testid="boat-name">
            {target.boatName}
          </h2>
          <p>
            {target.classCode} · {target.className}
            {target.ruleVersion != null ? ` · rules v${target.ruleVersion}` : ' · no rules in force'}
            {target.declarationVersion != null && (
              <span data-testid="declaration-version"> · declaration v{target.declarationVersion}</span>
            )}
          </p>
        </div>
        <div className="flex flex-col items-end gap-2">
          <StatusBadge status={target.status} />
          <span className={`font-bold ${target.isPaid ? 'text-pass-800' : 'text-fail-800'}`}>
            {target.isPaid ? '✓ Entry paid' : '✕ Entry not paid'}
          </span>
        </div>
      </div>
      {target.source !== 'server' && (
        <p className="rounded-lg bg-doubt-100 p-3 font-bold text-doubt-800" data-testid="offline-card">
          Offline:{' '}
          {target.source === 'phone-copy' ? 'from this phone’s copy of the entries' : 'the last card this phone saw'}.
          Earlier records may be missing.
        </p>
      )}
      {target.isOwnBoat && (
        <p className="rounded-lg bg-fail-100 p-3 font-bold text-fail-800">
          You entered or own this boat: another scrutineer must inspect it.
        </p>
      )}
      {card && (
        <>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
            <dt className="font-bold">Pump</dt>
            <dd>{card.boat.pumpDescription || '—'}</dd>
            <dt className="font-bold">Engine</dt>
            <dd>{card.boat.engineDescription || '—'}</dd>
            <dt className="font-bold">Nozzle</dt>
            <dd className="figure" data-testid="card-nozzle">
              {formatFigure(card.boat.declaredNozzleMm, 'nozzleMm')} declared
            </dd>
            <dt className="font-bold">Power</dt>
            <dd className="figure" data-testid="card-power">
              {formatFigure(card.boat.declaredPowerKw, 'powerKw')} declared
            </dd>
            <dt className="font-bold">Weight</dt>
            <dd className="figure">
              {card.boat.declaredWeightKg != null
                ? `${formatFigure(card.boat.declaredWeightKg, 'massKg')} declared`
                : 'not declared'}
            </dd>
          </dl>
          {card.declaration && card.declaration.rows.length > 0 && (
            <details>
              <summary className="min-h-touch cursor-pointer py-2 font-bold">
                Declaration against the rules (a warning, never a verdict)
              </summary>
              <ul className="space-y-1">
                {card.declaration.rows.map((r) => (
                  <li key={r.key}>
                    <strong>
                      {r.label}: {DECLARATION_STATUS_WORDS[r.status]}.
                    </strong>{' '}
                    {r.explanation}
                  </li>
                ))}
              </ul>
            </details>
          )}
          {card.openReinspections.length > 0 && (
            <p
              className="rounded-lg border-2 border-flare-500 bg-flare-100 p-3 font-bold"
              data-testid="open-reinspection"
            >
              Re-inspection required:{' '}
              {card.openReinspections
                .map(
                  (t) =>
                    // A declaration change's reason already starts with these words: said once.
                    `${t.reason.replace(/^Re-inspection required:\s*/, '')}${t.checks ? ` (checks the ${t.checks.map((c) => CHECK_AREA_LABELS[c]).join(', ')} only)` : ''}`,
                )
                .join('; ')}
            </p>
          )}
          {card.partsHeld?.length > 0 && (
            <p
              className="rounded-lg border-2 border-doubt-600 bg-doubt-100 p-3 text-doubt-800"
              data-testid="parts-held"
            >
              Held by the officials:{' '}
              {card.partsHeld
                .map((p) => `${p.description}${p.sealNumber ? ` (seal/bag ${p.sealNumber})` : ''}`)
                .join('; ')}
            </p>
          )}
          <div data-testid="card-seals">
            <h3 className="text-xl">Seals on this boat ({card.seals.length})</h3>
            {card.seals.length === 0 ? (
              <p>No register seals on its components.</p>
            ) : (
              <ul className="divide-y divide-paper-line">
                {card.seals.map((s) => (
                  <li key={s.sealId} className="py-1" data-seal={s.number}>
                    <strong>Seal {s.number}</strong> on the {s.component}
                    {s.position ? ` (${s.position})` : ''} · {SEAL_ACTION_WORDS[s.lastAction].toLowerCase()}{' '}
                    <OnDevice iso={s.lastAt} />
                  </li>
                ))}
              </ul>
            )}
          </div>
          <div>
            <h3 className="text-xl">Earlier records at this meeting ({card.inspections.length})</h3>
            {card.inspections.length === 0 ? (
              <p>None yet.</p>
            ) : (
              <ul className="divide-y divide-paper-line" data-testid="history">
                {card.inspections.map((i) => (
                  <li key={i.id} className="space-y-1 py-2" data-superseded={i.supersededById ? 'yes' : 'no'}>
                    <div className="flex flex-wrap items-center justify-between gap-2">
                      <span>
                        <OnDevice iso={i.capturedAt} /> · {INSPECTION_KIND_LABELS[i.kind as InspectionKind] ?? i.kind}
                      </span>
                      <VerdictBadge verdict={i.overallResult} />
                    </div>
                    <p className="text-ink-soft">
                      by {i.recordedBy.name}
                      {i.device ? ` on ${i.device}` : ''} · rules v{i.ruleVersion}
                    </p>
                    <p className="text-ink-soft" data-testid="history-power-evidence">
                      Power evidence: {describePowerEvidence(i.measurements?.power)}
                    </p>
                    {(i.measurements?.sealActions?.length ?? 0) > 0 && (
                      <p className="text-ink-soft" data-testid="history-seals">
                        Seals:{' '}
                        {i
                          .measurements!.sealActions!.map(
                            (a) => `${a.number} ${SEAL_ACTION_WORDS[a.action].toLowerCase()} (${a.component})`,
                          )
                          .join('; ')}
                      </p>
                    )}
                    {i.supersedesId && <p className="font-bold">Correction: {i.correctionReason}</p>}
                    {i.supersededById ? (
                      <p className="font-bold text-ink-soft">Superseded by a later correction (kept in the record).</p>
                    ) : (
                      !target.isOwnBoat && (
                        <button type="button" className="btn-secondary text-lg" onClick={() => onCorrect(i)}>
                          Correct this record
                        </button>
                      )
                    )}
                  </li>
                ))}
              </ul>
            )}
          </div>
        </>
      )}
    </section>
  );
}
