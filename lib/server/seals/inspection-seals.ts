import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import type { InspectionSealsInput } from '@/lib/core/inputs/seals';
import type { SealFinding } from '@/lib/core/inspections/decide-inspection';
import type { StoredSealAction } from '@/models/shapes/inspection-record';
import type { SealAction } from '@/models/boat-record';
import { describeComponent } from '@/lib/core/seals/seal-words';
import { loadBoatSeals } from './boat-seals';
import { sealKeySql } from './seal-key';
import { sealNumberKey } from '@/lib/core/inputs/seals';

// The seals part of recording an inspection: checked before anything is written (every refusal names
// its field), then written in the inspection's own transaction, so a record and its seal events are
// stored together or not at all, and a replayed record (same key) writes none.

type PlannedEvent = {
  sealId: string;
  number: string;
  action: SealAction;
  componentId: string;
  component: string;
  position: string;
  reason: string;
  /** The seal's latest event when checked (null: unused), to see whether it changed before writing. */
  lastEventId: string | null;
};

export type InspectionSealPlan = {
  events: PlannedEvent[];
  findings: SealFinding[];
  actions: StoredSealAction[];
};

const refuse = (issues: { field: string; message: string }[]) =>
  new AppError('invalid_input', 400, issues.map((i) => `${i.field}: ${i.message}`).join('; '), issues);

/** Checks the seal actions against the register and the boat's components now. */
export async function planInspectionSeals(
  eventId: string,
  boatId: string,
  seals: InspectionSealsInput,
): Promise<InspectionSealPlan> {
  const { checks, applied, removed } = seals;
  const empty = { events: [], findings: [], actions: [] };
  if (!checks.length && !applied.length && !removed.length) return empty;
  const issues: { field: string; message: string }[] = [];
  const onBoat = new Map((await loadBoatSeals(boatId)).map((s) => [sealNumberKey(s.number), s]));
  const events: PlannedEvent[] = [];

  checks.forEach((c, i) => {
    const s = onBoat.get(sealNumberKey(c.number));
    if (!s) {
      issues.push({ field: `seals.checks.${i}.number`, message: `Seal ${c.number} is not on this boat’s components.` });
      return;
    }
    events.push({ ...current(s), action: c.state, reason: '' });
  });
  removed.forEach((r, i) => {
    const s = onBoat.get(sealNumberKey(r.number));
    if (!s) {
      issues.push({
        field: `seals.removed.${i}.number`,
        message: `Seal ${r.number} is not on this boat’s components, so it cannot be removed.`,
      });
      return;
    }
    events.push({ ...current(s), action: 'removed', reason: r.reason });
  });

  if (applied.length) {
    const { sequelize, models } = getDb();
    const found = await sequelize.query<{
      id: string;
      number: string;
      batchEventId: string | null;
      lastAction: SealAction | null;
    }>(
      `select s.id, upper(s.number) as number, b.event_id as "batchEventId",
              (select e.action from seal_events e where e.seal_id = s.id order by e.created_at desc, e.id desc limit 1) as "lastAction"
         from seals s join seal_batches b on b.id = s.batch_id
        where ${sealKeySql('s.number')} in (:keys) and b.event_id = :eventId`,
      { replacements: { keys: applied.map((a) => sealNumberKey(a.number)), eventId }, type: QueryTypes.SELECT },
    );
    const byNumber = new Map(found.map((f) => [sealNumberKey(f.number), f]));
    const components = await models.BoatComponent.findAll({
      where: { id: applied.map((a) => a.componentId), boatId },
    });
    const byId = new Map(components.map((c) => [c.id, c]));
    applied.forEach((a, i) => {
      const s = byNumber.get(sealNumberKey(a.number));
      const field = `seals.applied.${i}.number`;
      if (!s || s.batchEventId !== eventId) {
        issues.push({
          field,
          message: `Seal ${a.number} is not in a batch issued to this meeting: apply only seals from this meeting’s batches.`,
        });
      } else if (s.lastAction) {
        issues.push({ field, message: `Seal ${a.number} has been used already: a seal is applied once.` });
      }
      const c = byId.get(a.componentId.toLowerCase());
      if (!c)
        issues.push({ field: `seals.applied.${i}.componentId`, message: 'Choose one of this boat’s components.' });
      if (s && c)
        events.push({
          sealId: s.id,
          number: s.number, // as printed on the seal, whatever zeros were typed
          action: 'applied',
          componentId: c.id,
          component: describeComponent(c),
          position: a.position,
          reason: '',
          lastEventId: null,
        });
    });
  }
  if (issues.length) throw refuse(issues);
  return {
    events,
    findings: events
      .filter((e): e is PlannedEvent & { action: SealFinding['state'] } =>
        ['intact', 'broken', 'missing'].includes(e.action),
      )
      .map((e) => ({ number: e.number, state: e.action, component: e.component })),
    actions: events.map((e) => ({
      number: e.number,
      action: e.action,
      componentId: e.componentId,
      component: e.component,
      position: e.position,
      reason: e.reason,
    })),
  };
}

function current(s: Awaited<ReturnType<typeof loadBoatSeals>>[number]) {
  return {
    sealId: s.sealId,
    number: s.number.toUpperCase(),
    componentId: s.componentId,
    component: s.component,
    position: s.position,
    lastEventId: s.lastEventId,
  };
}

/**
 * Writes the planned seal events in the inspection's transaction. The seals are locked first and
 * each one's latest event compared with what was planned, so two records sent at once cannot both
 * apply the same seal, nor check a seal another record just removed.
 */
export async function writeInspectionSealEvents(
  plan: InspectionSealPlan,
  at: { inspectionId: string; eventId: string; boatId: string; recordedById: string },
  transaction: Transaction,
): Promise<void> {
  if (!plan.events.length) return;
  const { sequelize } = getDb();
  const ids = [...new Set(plan.events.map((e) => e.sealId))];
  await sequelize.query('select id from seals where id in (:ids) order by id for update', {
    replacements: { ids },
    transaction,
  });
  const latest = await sequelize.query<{ sealId: string; lastEventId: string | null }>(
    `select s.id as "sealId",
            (select e.id from seal_events e where e.seal_id = s.id order by e.created_at desc, e.id desc limit 1) as "lastEventId"
       from seals s where s.id in (:ids)`,
    { replacements: { ids }, type: QueryTypes.SELECT, transaction },
  );
  const now = new Map(latest.map((l) => [l.sealId, l.lastEventId]));
  for (const e of plan.events) {
    if ((now.get(e.sealId) ?? null) !== e.lastEventId)
      throw new AppError(
        'seal_changed',
        409,
        `Seal ${e.number} was recorded by someone else a moment ago: load the boat again and check its seals.`,
      );
  }
  // One row at a time (a record carries a few): clock_timestamp() gives each its own time, so the order written is the order kept.
  for (const e of plan.events) {
    await sequelize.query(
      `insert into seal_events (seal_id, action, component_id, boat_id, event_id, inspection_id, position, reason, recorded_by_id, created_at)
       values (:sealId, :action, :componentId, :boatId, :eventId, :inspectionId, :position, :reason, :recordedById, clock_timestamp())`,
      {
        replacements: {
          ...at,
          sealId: e.sealId,
          action: e.action,
          componentId: e.componentId,
          position: e.position,
          reason: e.reason,
        },
        transaction,
      },
    );
  }
}
