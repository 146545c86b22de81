import type { Metadata } from 'next';
import Link from '@/components/link';
import { formatTime } from '@/lib/core/format/time';
import { diffRules, ruleLabel } from '@/lib/core/classes/diff-rules';
import { SafetyNote } from '@/components/safety-note';
import {
  BURDEN_CONTEXTS,
  BURDEN_CONTEXT_WORDS,
  BURDEN_WORDS,
  resolveBurdenRules,
} from '@/lib/core/engine/conformity-burden';
import { openClassRules } from '../../../access';
import { RulesForm } from '../rules-form';
import { PublishForm } from '../publish-form';
import { CrewRequirementsPanel } from '@/components/crew-requirements-panel';

export const metadata: Metadata = { title: 'Class rules' };

const show = (v: unknown) => (v === null || v === undefined ? '—' : Array.isArray(v) ? v.join(', ') : String(v));

export default async function ClassPage({ params }: { params: Promise<{ eventId: string; classId: string }> }) {
  const { actor, eventId, classId, cls } = await openClassRules(params);
  const { raceClass, versions, timeZone } = cls;
  const latest = versions[0];
  const isDraft = latest.status === 'draft';
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>Meeting</Link> /{' '}
        {raceClass.code}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>
          {raceClass.code} · {raceClass.name}
        </h1>
        {versions.some((v) => v.status === 'published') && (
          <Link href={`/organise/events/${eventId}/classes/${classId}/report`} className="btn-primary">
            Parity report
          </Link>
        )}
      </div>
      {raceClass.description && <p className="text-ink-soft">{raceClass.description}</p>}
      <SafetyNote />
      <section className="card space-y-4" aria-labelledby="edit">
        <h2 id="edit">
          {isDraft
            ? `Draft rules, version ${latest.version}`
            : `Rules (version ${latest.version} is published and frozen)`}
        </h2>
        {!isDraft && (
          <p>
            Saving opens draft version {latest.version + 1}; version {latest.version} stays exactly as published.
          </p>
        )}
        <RulesForm
          eventId={eventId}
          classId={classId}
          rules={latest.rules}
          editingVersion={latest.version}
          isDraft={isDraft}
        />
        {isDraft && <PublishForm eventId={eventId} classId={classId} version={latest.version} timeZone={timeZone} />}
      </section>
      <CrewRequirementsPanel actor={actor} eventId={eventId} classId={classId} />
      <section className="card space-y-4" aria-labelledby="history">
        <h2 id="history">Version history</h2>
        <ol className="space-y-4" data-testid="version-history">
          {versions.map((v, i) => {
            const previous = versions[i + 1];
            // Rules stored before the burden of proof existed read with its defaults, so no change is shown where none was made.
            // Likewise the nozzle's check method: absent means two-point readings.
            const withBurden = (r: typeof v.rules) => ({
              ...r,
              nozzle: { ...r.nozzle, checkMethod: r.nozzle.checkMethod ?? 'two_point' },
              burdenOfProof: resolveBurdenRules(r),
            });
            const changes = previous ? diffRules(withBurden(previous.rules), withBurden(v.rules)) : [];
            const burden = resolveBurdenRules(v.rules);
            return (
              <li key={v.id} className="rounded-lg border border-paper-line p-4">
                <p className="font-bold">
                  Version {v.version} ·{' '}
                  {v.status === 'published'
                    ? `published ${formatTime(v.publishedAt!, timeZone)}, in force from ${formatTime(v.effectiveFrom!, timeZone)}`
                    : 'draft'}
                </p>
                {v.changeNote && <p className="text-ink-soft">{v.changeNote}</p>}
                <ul className="text-sm" data-testid="version-burden">
                  {BURDEN_CONTEXTS.map((c) => (
                    <li key={c}>
                      {BURDEN_CONTEXT_WORDS[c]}: {BURDEN_WORDS[burden[c]]}.
                    </li>
                  ))}
                </ul>
                {previous &&
                  (changes.length === 0 ? (
                    <p className="text-sm">No change from version {previous.version}.</p>
                  ) : (
                    <table className="mt-2 w-full text-left text-sm">
                      <thead>
                        <tr>
                          <th className="py-1 pr-2">Rule</th>
                          <th className="py-1 pr-2">v{previous.version}</th>
                          <th className="py-1">v{v.version}</th>
                        </tr>
                      </thead>
                      <tbody>
                        {changes.map((c) => (
                          <tr key={c.path} className="border-t border-paper-line">
                            <td className="py-1 pr-2">{ruleLabel(c.path)}</td>
                            <td className="figure py-1 pr-2 text-fail-600 line-through">{show(c.before)}</td>
                            <td className="figure py-1 font-bold text-pass-600">{show(c.after)}</td>
                          </tr>
                        ))}
                      </tbody>
                    </table>
                  ))}
              </li>
            );
          })}
        </ol>
      </section>
    </div>
  );
}
