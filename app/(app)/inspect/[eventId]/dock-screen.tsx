'use client';

import { startTransition, useCallback, useEffect, useEffectEvent, useRef, useState } from 'react';
import Link from '@/components/link';
import dynamic from 'next/dynamic';
import { parseTagScan } from '@/lib/core/tags/parse-tag-scan';
import { requestJson } from '@/components/forms/request-json';
import {
  loadSnapshot,
  putQueued,
  saveSnapshot,
  sendQueued,
  type EventSnapshot,
  type QueuedRecord,
} from '@/app/(app)/inspect/[eventId]/offline-queue';
import type { InspectionView } from '@/lib/server/inspections/inspection-view';
import type { BoatCard } from '@/lib/server/inspections/load-boat-card';
import type { InstrumentView } from '@/lib/server/inspections/list-instruments';
import { describeScope } from '@/lib/core/inspections/check-areas';
import { FindBoat, type FindQuery } from './find-boat';
import { newKey } from './phone-identity';
import {
  firstBoardRow,
  formFromDraft,
  initialFormState,
  targetFromBoardRow,
  targetFromCard,
  type DockTarget,
  type FormState,
  type OtherEntry,
} from './form-model';
import type { FormSubmission } from './inspection-form';
import { QueuePanel } from './queue-panel';
import { ClassSwitcher } from './class-switcher';
import { askForBackgroundSend, registerInspectServiceWorker, useDockQueue } from './use-dock-queue';
import type { ShownVerdict } from './verdict-panel';
import { loadDockParts } from './dock-parts';
import { describePowerEvidence } from '@/lib/core/inspections/power-evidence';

// Crew and dated gear beside the card (issue 21), loaded when a boat is open: it keeps the dock's first load under budget.
const GearDockPanel = dynamic(() => import('@/components/gear-dock-panel').then((m) => m.GearDockPanel), {
  ssr: false,
});

// The boat card, the record form and the verdict appear only once a boat is found: their code is not part of
// the screen's first load (a phone on one bar of signal gets the finder sooner, with less script to run
// before it answers). They are fetched when the phone is idle after the first paint, and kept by the
// service worker for use with no signal (registerInspectServiceWorker), or at once when a boat is opened.
const BoatCardView = dynamic(() => import('./boat-card-view').then((m) => m.BoatCardView));
const InspectionForm = dynamic(() => import('./inspection-form').then((m) => m.InspectionForm));
const VerdictPanel = dynamic(() => import('./verdict-panel').then((m) => m.VerdictPanel));

/** Cards that came with a page and have been shown (see startCard in DockScreen). */
const shownCards = new WeakSet<BoatCard>();

type Notice = { tone: 'error' | 'info'; text: string; code?: string };
type Answer = {
  status: number;
  ok: boolean;
  fromCache: boolean;
  data: unknown;
  code?: string;
  message?: string;
} | null;

/** A GET of the dock's data; null when there is no answer at all (no signal, and the service worker had no copy). */
async function get(url: string): Promise<Answer> {
  const answer = await requestJson(url, {
    method: 'GET',
    fallbackMessage: (status) => `The lookup was refused (${status}).`,
  });
  if (answer.status === 0 || (!answer.ok && answer.status === 503 && answer.code === 'offline')) return null;
  const fromCache = answer.headers?.get('X-Served-From') === 'cache';
  return answer.ok
    ? { status: answer.status, ok: true, fromCache, data: answer.data }
    : { status: answer.status, ok: false, fromCache, data: undefined, code: answer.code, message: answer.message };
}

/** The dock: find the boat, see its card, record, see the verdict; the phone's outbox beside it. */
export function DockScreen({
  eventId,
  actorId,
  instruments,
  canOpenLogbook,
  opensFromLink = false,
  initialCard = null,
}: {
  eventId: string;
  actorId: string;
  instruments: InstrumentView[];
  /** Officials with entry.view_all may open the boat's logbook from its card. */
  canOpenLogbook: boolean;
  /** Opened with ?race= or ?tag=: a boat's card and form will appear above the phone's outbox. */
  opensFromLink?: boolean;
  /** The card found by the server for ?race= or ?tag=: shown, with its form, from the first HTML (no lookup here). */
  initialCard?: BoatCard | null;
}) {
  const queue = useDockQueue(eventId, actorId);
  // The first usable one (an overdue instrument, or one out of use after a failed check today, is never preselected).
  const defaultLength = instruments.find((i) => i.quantity === 'length' && i.calibration.usable)?.id ?? null;
  const defaultScale = instruments.find((i) => i.quantity === 'mass' && i.calibration.usable)?.id ?? null;
  const [snapshot, setSnapshot] = useState<EventSnapshot | null>(null);
  // The card that came with the page is shown as it is the first time only: the same card again is the page restored
  // from the browser's history (Next.js keeps it), as old as that visit, so it is looked up afresh as a link opened
  // here is. No clocks compared.
  const [startCard] = useState(() => (initialCard && !shownCards.has(initialCard) ? initialCard : null));
  useEffect(() => {
    if (initialCard) shownCards.add(initialCard);
  }, [initialCard]);
  const [target, setTarget] = useState<DockTarget | null>(() => (startCard ? targetFromCard(startCard, false) : null));
  const [form, setForm] = useState<{ key: string; initial: FormState; revision: number } | null>(() =>
    // The key is made here, on the phone (it is not in the HTML): a page shown again from the browser's history
    // would otherwise bring back a key already sent, and the server answers a repeated key with the first record.
    target ? { key: newKey(), initial: initialFormState(target, defaultLength, defaultScale), revision: 1 } : null,
  );
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<Notice | null>(null);
  const [verdict, setVerdict] = useState<ShownVerdict | null>(null);
  const [isLooking, setLooking] = useState(false);
  const [stale, setStale] = useState<QueuedRecord | null>(null);
  const [followUp, setFollowUp] = useState<{ raceNumber: number; boatName: string; others: OtherEntry[] } | null>(null);
  const verdictRef = useRef<HTMLDivElement>(null);

  // Keep the phone's copy of the entries (and class rules) fresh whenever there is a signal.
  const refreshSnapshot = useCallback(async () => {
    const answer = await get(`/api/events/${eventId}/inspections`);
    if (answer?.ok && !answer.fromCache) {
      const snap: EventSnapshot = {
        eventId,
        savedAt: new Date().toISOString(),
        board: answer.data as EventSnapshot['board'],
        instruments,
      };
      await saveSnapshot(snap);
      setSnapshot(snap);
    } else {
      setSnapshot((await loadSnapshot(eventId)) ?? null);
    }
  }, [eventId, instruments]);

  useEffect(() => registerInspectServiceWorker(), []);
  useEffect(() => {
    // On opening and whenever the signal comes back (the update lands after the request answers).
    const t = window.setTimeout(() => void refreshSnapshot(), 0);
    return () => window.clearTimeout(t);
  }, [refreshSnapshot, queue.isOnline]);

  function open(t: DockTarget, initial?: FormState, key?: string) {
    // A transition: React renders the card and the form (the screen's largest render) in slices of a few
    // milliseconds, so a phone stays responsive to a tap while they are drawn.
    startTransition(() => {
      setStale(null);
      setTarget(t);
      setVerdict(null);
      setServerErrors({});
      setForm((f) => ({
        key: key ?? newKey(),
        initial: initial ?? initialFormState(t, defaultLength, defaultScale),
        revision: (f?.revision ?? 0) + 1,
      }));
    });
  }

  async function find(q: FindQuery) {
    setNotice(null);
    setVerdict(null);
    setFollowUp(null);
    const text = q.text.trim();
    const isRaceNumber = q.kind === 'typed' && /^\d{1,4}$/.test(text);
    const token = isRaceNumber ? null : parseTagScan(text);
    if (!isRaceNumber && !token) {
      setTarget(null);
      return setNotice({
        tone: 'error',
        code: 'unknown_tag',
        text: 'That is not a Boreline tag: the code is unreadable or from another system. Type the race number instead.',
      });
    }
    setLooking(true);
    const answer = await get(
      isRaceNumber
        ? `/api/events/${eventId}/race-numbers/${text}`
        : `/api/events/${eventId}/tags/${encodeURIComponent(token!)}`,
    );
    setLooking(false);
    if (answer?.ok) return open(targetFromCard(answer.data as never, answer.fromCache));
    if (answer && answer.status < 500) {
      setTarget(null);
      return setNotice({
        tone: 'error',
        code: answer.code,
        text: answer.message ?? `The lookup was refused (${answer.status}).`,
      });
    }
    // No signal (or the server is down): the phone's copy of the entries.
    const snap = snapshot ?? (await loadSnapshot(eventId)) ?? null;
    const row = firstBoardRow(
      snap?.board.rows.filter((r) => (isRaceNumber ? r.raceNumber === Number(text) : r.tagToken === token)) ?? [],
    );
    if (snap && row) return open(targetFromBoardRow(row, snap.board));
    setTarget(null);
    setNotice({
      tone: 'error',
      code: 'offline_unknown',
      text: snap
        ? `No signal, and ${isRaceNumber ? `race number ${text}` : 'this tag'} is not in this phone’s copy of the entries.`
        : 'No signal, and this phone has no copy of the entries yet: open the dock screen once with a signal.',
    });
  }

  async function record({ draft, photos, sealPhotos, provisional }: FormSubmission) {
    if (!target) return;
    // A boat in several classes here: the label names the class the record is for.
    const label = `No. ${target.raceNumber} ${target.boatName}${target.otherEntries.length > 0 ? ` in ${target.classCode}` : ''}`;
    const queued: QueuedRecord = {
      idempotencyKey: draft.idempotencyKey,
      eventId,
      recordedById: actorId,
      label,
      payload: draft,
      photos: [
        ...photos.map((p) => ({ name: p.name, type: p.type, blob: p })),
        ...(sealPhotos ?? []).map((p) => ({
          name: p.file.name,
          type: p.file.type,
          blob: p.file,
          sealNumber: p.number,
        })),
      ],
      state: 'waiting',
      attempts: 0,
      createdAt: new Date().toISOString(),
      lastTriedAt: null,
      message: null,
      fieldErrors: {},
      inspectionId: null,
      overallResult: null,
      serverRules: null,
      sentAt: null,
    };
    await putQueued(queued); // on the phone first, whatever happens next
    const after = navigator.onLine ? await sendQueued(queued) : queued;
    // Still waiting: the service worker sends it when the signal returns, even if this page is closed by then.
    if (after.state === 'waiting') void askForBackgroundSend();
    await queue.refresh();
    if (after.state === 'needs_fix' && !after.inspectionId) {
      // Refused: the form stays open with the server's messages beside the fields, and the same key.
      setServerErrors(after.fieldErrors);
      setNotice({
        tone: 'error',
        code: after.code,
        text: `Not recorded: ${(after.message ?? 'the server refused it').replace(/\.?$/, '.')} It is kept on this phone under “Needs a fix”.`,
      });
      // The declaration changed since the card was opened: offer the card again, keeping what was typed.
      setStale(after.code === 'declaration_changed' ? after : null);
      return;
    }
    setVerdict({
      label,
      rules: after.serverRules ?? provisional?.rules ?? [],
      overall: after.overallResult ?? provisional?.overall ?? 'pending',
      provisional: !after.serverRules,
      inspectionId: after.inspectionId,
      scopeWords: describeScope(target.card?.openReinspections.find((t) => t.id === draft.reinspectionId)?.checks),
      powerEvidence: describePowerEvidence({
        evidenceSeen: draft.power.evidenceSeen,
        evidenceKind: draft.power.evidenceKind ?? null,
        dynoDocument: target.card?.documents.find((d) => d.id === draft.power.dynoDocumentId) ?? null,
      }),
    });
    setNotice(
      after.state === 'sent'
        ? { tone: 'info', text: `Recorded and sent: ${label}.` }
        : { tone: 'info', text: `Kept on this phone: ${label}. Waiting to send.` },
    );
    // The same boat in another class here: offer that class's inspection next (its own record, its own rules).
    setFollowUp(
      target.otherEntries.length > 0
        ? { raceNumber: target.raceNumber, boatName: target.boatName, others: target.otherEntries }
        : null,
    );
    setTarget(null);
    setForm(null);
    if (after.state === 'sent') void refreshSnapshot();
  }

  async function fix(r: QueuedRecord) {
    const snap = snapshot ?? (await loadSnapshot(eventId)) ?? null;
    const row = snap?.board.rows.find((x) => x.entryId === r.payload.entryId);
    const answer = row ? await get(`/api/events/${eventId}/race-numbers/${row.raceNumber}?entry=${row.entryId}`) : null;
    const t = answer?.ok
      ? targetFromCard(answer.data as never, answer.fromCache)
      : row && snap
        ? targetFromBoardRow(row, snap.board)
        : null;
    if (!t)
      return setNotice({
        tone: 'error',
        text: 'This boat is not in the phone’s copy of the entries: open the dock screen with a signal first.',
      });
    open(t, formFromDraft(r.payload, initialFormState(t, defaultLength, defaultScale)), r.idempotencyKey);
    setServerErrors(r.fieldErrors);
    setNotice({ tone: 'error', text: `Fix and send again: ${r.message ?? ''}` });
  }

  /** The same boat in another class here: that class's card and a fresh form, judged under its own rules. */
  async function switchEntry(entryId: string, raceNumber: number) {
    setNotice(null);
    setFollowUp(null);
    setLooking(true);
    const answer = await get(`/api/events/${eventId}/race-numbers/${raceNumber}?entry=${entryId}`);
    setLooking(false);
    if (answer?.ok) return open(targetFromCard(answer.data as never, answer.fromCache));
    if (answer && answer.status < 500)
      return setNotice({ tone: 'error', code: answer.code, text: answer.message ?? 'The lookup was refused.' });
    const snap = snapshot ?? (await loadSnapshot(eventId)) ?? null;
    const row = snap?.board.rows.find((r) => r.entryId === entryId);
    if (snap && row) return open(targetFromBoardRow(row, snap.board));
    setNotice({
      tone: 'error',
      code: 'offline_unknown',
      text: 'No signal, and that class is not in this phone’s copy.',
    });
  }

  function correct(original: InspectionView) {
    if (!target || !form) return;
    setForm({
      ...form,
      initial: { ...form.initial, supersedesId: original.id, correctionReason: '' },
      revision: form.revision + 1,
    });
    setNotice({
      tone: 'info',
      text: `Correcting the record of ${new Date(original.capturedAt).toLocaleString()}: measure or re-enter, then say why.`,
    });
  }

  // Recording is tapped at the bottom of a long form: bring the verdict into view (and focus) when it arrives.
  useEffect(() => {
    if (!verdict || !verdictRef.current) return;
    verdictRef.current.scrollIntoView({ block: 'start' });
    verdictRef.current.focus({ preventScroll: true });
  }, [verdict]);

  // Opened from a link (board or tag): on a phone the card sits below the finder, so bring it into view.
  const isOpenedFromLink = useRef(false);
  useEffect(() => {
    if (!target || !isOpenedFromLink.current) return;
    isOpenedFromLink.current = false;
    document.getElementById('boat-heading')?.scrollIntoView({ block: 'start' });
  }, [target]);

  const openFromLink = useEffectEvent(() => {
    // From the board's re-inspection list: /inspect/<event>?race=42 opens that boat; from a tag
    // scanned with the phone's own camera (/t/<token> sends scrutineers here): ?tag=<token>.
    const query = new URLSearchParams(window.location.search);
    const race = query.get('race');
    const tag = query.get('tag');
    // The server found this boat already: its card and form came with the page; only bring them into view.
    if (startCard) {
      document.getElementById('boat-heading')?.scrollIntoView({ block: 'start' });
      return;
    }
    isOpenedFromLink.current = Boolean(race || tag);
    // The card and form are wanted at once: their code is fetched beside the lookup, not after it.
    if (race || tag) void loadDockParts().catch(() => undefined);
    if (race) void find({ kind: 'typed', text: race });
    else if (tag) void find({ kind: 'scan', text: tag });
  });
  useEffect(() => {
    const t = window.setTimeout(openFromLink, 0);
    return () => window.clearTimeout(t);
  }, []);

  return (
    <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
      {/* Opened from a link, the card and form arrive after the first paint: the column holds a screen's height
          from the start, so on a phone the outbox below is not seen jumping down (a layout shift). */}
      <div className={`space-y-4 ${opensFromLink ? 'max-lg:min-h-screen' : ''}`}>
        <FindBoat onFind={(q) => void find(q)} isBusy={isLooking} />
        {isLooking && (
          <p role="status" className="text-lg">
            Looking up…
          </p>
        )}
        {/* A live region: a recorded verdict is announced as well as focused (WCAG 2.2 SC 4.1.3). */}
        <div
          ref={verdictRef}
          tabIndex={-1}
          id="dock-verdict"
          aria-live="polite"
          className="scroll-mt-4 space-y-4 outline-none"
        >
          {notice && (
            <p
              role="status"
              aria-live="polite"
              data-testid="dock-notice"
              data-code={notice.code ?? ''}
              className={`rounded-lg p-3 text-lg font-bold ${notice.tone === 'error' ? 'bg-fail-100 text-fail-800' : 'bg-tide-50 text-tide-700'}`}
            >
              {notice.text}
            </p>
          )}
          {stale && (
            <button
              type="button"
              className="btn-primary text-lg"
              data-testid="reload-card"
              onClick={() => void fix(stale)}
            >
              Reload the boat card
            </button>
          )}
          {verdict && (
            <VerdictPanel
              verdict={verdict}
              onNext={() => {
                setVerdict(null);
                setNotice(null);
                setFollowUp(null);
              }}
            />
          )}
          {verdict && followUp && (
            <ClassSwitcher
              raceNumber={followUp.raceNumber}
              boatName={followUp.boatName}
              current={null}
              others={followUp.others}
              onSwitch={(id) => void switchEntry(id, followUp.raceNumber)}
            />
          )}
        </div>
        {target && target.otherEntries.length > 0 && (
          <ClassSwitcher
            raceNumber={target.raceNumber}
            boatName={target.boatName}
            current={`${target.classCode} ${target.className}`}
            others={target.otherEntries}
            onSwitch={(id) => void switchEntry(id, target.raceNumber)}
          />
        )}
        {target && <BoatCardView target={target} onCorrect={correct} />}
        {target && (
          <GearDockPanel
            key={target.entryId}
            eventId={eventId}
            entryId={target.entryId}
            canRecord={!target.isOwnBoat}
          />
        )}
        {canOpenLogbook && target?.card && (
          <Link href={`/boats/${target.card.boat.id}/logbook`}>This boat&apos;s logbook</Link>
        )}
        {target && form && !target.isOwnBoat && (
          <InspectionForm
            key={`${form.key}-${form.revision}`}
            target={target}
            instruments={instruments}
            initial={form.initial}
            idempotencyKey={form.key}
            serverErrors={serverErrors}
            onSubmit={record}
          />
        )}
      </div>
      <QueuePanel
        records={queue.records}
        actorId={actorId}
        isOnline={queue.isOnline}
        onSendNow={() => void queue.flush()}
        onFix={(r) => void fix(r)}
        onRemove={(r) => void queue.remove(r)}
      />
    </div>
  );
}
