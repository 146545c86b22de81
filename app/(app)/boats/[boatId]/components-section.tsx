import { format, parseISO } from 'date-fns';
import { COMPONENT_KIND_LABELS } from '@/lib/core/inputs/components';
import type { BoatComponents } from '@/lib/server/components/list-my-components';
import type { ComponentEventView, ComponentView } from '@/lib/server/components/component-view';
import { EditComponentForm, MoveComponentForm, RegisterComponentForm } from './component-forms';

// The boat page's components: each engine, pump and impeller with its identity, where it is, its
// seals and its whole history; forms to register, edit, move or take off, and to fit one of the
// owner's components that is on no boat.

const when = (iso: string) => format(parseISO(iso), 'd MMM yyyy, HH:mm');
const FIELD_LABELS: Record<string, string> = { maker: 'maker', model: 'model', trimCode: 'trim code', notes: 'notes' };
const quoted = (v: unknown) => (v === '' || v == null ? '(none)' : `“${String(v)}”`);

function describeEvent(e: ComponentEventView): string {
  const where = e.boatName ?? 'a boat';
  if (e.action === 'registered') return e.boatId ? `Registered on ${where}` : 'Registered';
  if (e.action === 'fitted') return `Fitted to ${where}`;
  if (e.action === 'removed') return `Taken off ${where}`;
  const before = (e.details.before ?? {}) as Record<string, unknown>;
  const after = (e.details.after ?? {}) as Record<string, unknown>;
  const changed = Object.keys(after).map((k) => `${FIELD_LABELS[k] ?? k} ${quoted(before[k])} → ${quoted(after[k])}`);
  return `Edited: ${changed.join('; ') || 'no change'}`;
}

function ComponentCard({
  component,
  moveTo,
  fitTo,
}: {
  component: ComponentView;
  moveTo: { id: string; name: string }[];
  fitTo?: { id: string; name: string };
}) {
  const c = component;
  const row = (label: string, value: React.ReactNode) => (
    <>
      <dt className="font-bold">{label}</dt>
      <dd className="mb-2 sm:mb-0">{value || <span className="text-ink-mute">—</span>}</dd>
    </>
  );
  return (
    <li className="space-y-2 py-3" data-testid="component" data-serial={c.serialNumber}>
      <h3 className="text-lg">
        {COMPONENT_KIND_LABELS[c.kind]}
        {(c.maker || c.model) && <span className="font-normal"> · {[c.maker, c.model].filter(Boolean).join(' ')}</span>}
      </h3>
      <dl className="grid gap-x-4 sm:grid-cols-[10rem_1fr] sm:gap-y-1">
        {row('Serial number', <span className="figure break-all">{c.serialNumber}</span>)}
        {row('Trim code', c.trimCode && <span className="figure">{c.trimCode}</span>)}
        {row('Where it is', c.boatName ?? 'On no boat')}
        {c.notes && row('Notes', <span className="whitespace-pre-line">{c.notes}</span>)}
        {row(
          'Seals',
          c.seals.length > 0 && (
            <ul data-testid="component-seals">
              {c.seals.map((s) => (
                <li key={s.sealId}>
                  <span className="figure font-bold">{s.number}</span>
                  {s.position && ` · ${s.position}`} · applied {when(s.appliedAt)} by {s.appliedBy}
                  {s.lastAction === 'intact' && ` · found intact ${when(s.lastSeenAt)}`}
                </li>
              ))}
            </ul>
          ),
        )}
      </dl>
      {c.seals.length > 0 && (
        <p className="text-sm text-ink-soft">
          Seals are applied and checked by the scrutineers; do not open a sealed part. Officials decide every verdict
          and safety matter.
        </p>
      )}
      <details className="rounded-lg bg-paper-deep p-3">
        <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">
          History ({c.history.length})
        </summary>
        <ol className="mt-2 divide-y divide-paper-line text-sm" data-testid="component-history">
          {c.history.map((e, i) => (
            <li key={i} className="py-1">
              {describeEvent(e)} · {when(e.createdAt)} · {e.recordedBy}
            </li>
          ))}
        </ol>
      </details>
      {fitTo ? (
        <MoveComponentForm component={c} boats={[]} fitTo={fitTo} />
      ) : (
        <>
          <details className="rounded-lg bg-paper-deep p-3">
            <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">Edit</summary>
            <EditComponentForm component={c} />
          </details>
          <details className="rounded-lg bg-paper-deep p-3">
            <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">Move or take off</summary>
            <MoveComponentForm component={c} boats={moveTo} />
          </details>
        </>
      )}
    </li>
  );
}

export function ComponentsSection({
  boat,
  components,
}: {
  boat: { id: string; name: string };
  components: BoatComponents;
}) {
  const { fitted, loose, otherBoats } = components;
  return (
    <section className="card space-y-3" aria-labelledby="components">
      <h2 id="components" className="text-xl">
        Components
      </h2>
      <p className="text-ink-soft">
        The engine, jet pump and impeller by serial number. They belong to the declaration: each change makes a new
        version, and a part moved to another of your boats keeps its history and seals.
      </p>
      {fitted.length === 0 ? (
        <p className="text-ink-mute">No components registered on this boat yet.</p>
      ) : (
        <ul className="divide-y divide-paper-line" data-testid="components">
          {fitted.map((c) => (
            <ComponentCard key={c.id} component={c} moveTo={otherBoats} />
          ))}
        </ul>
      )}
      {loose.length > 0 && (
        <details className="rounded-lg bg-paper-deep p-4">
          <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">
            Your components on no boat ({loose.length})
          </summary>
          <ul className="divide-y divide-paper-line" data-testid="loose-components">
            {loose.map((c) => (
              <ComponentCard key={c.id} component={c} moveTo={[]} fitTo={boat} />
            ))}
          </ul>
        </details>
      )}
      <details className="rounded-lg bg-paper-deep p-4">
        <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">Register a component</summary>
        <div className="mt-3">
          <RegisterComponentForm boatId={boat.id} />
        </div>
      </details>
    </section>
  );
}
