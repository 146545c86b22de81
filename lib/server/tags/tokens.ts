import 'server-only';
import { randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { appUrl } from '@/lib/server/config/env';

// QR tags carry an unguessable token (144 random bits), never a database id.
export const newTagToken = () => randomBytes(18).toString('base64url');

export function tagUrl(token: string) {
  return `${appUrl()}/t/${token}`;
}

/** The boat's current tag token, issuing one if it has none. */
export async function ensureCurrentTag(boatId: string, transaction?: Transaction): Promise<string> {
  const { BoatTag } = getDb().models;
  const current = await BoatTag.findOne({ where: { boatId, retiredAt: null }, transaction });
  if (current) return current.token;
  const [tag] = await BoatTag.findOrCreate({
    where: { boatId, retiredAt: null },
    defaults: { boatId, token: newTagToken() },
    transaction,
  });
  return tag.token;
}

/** Current tokens for many boats at once (one query, then one insert for those without a tag). */
export async function ensureCurrentTags(boatIds: string[]): Promise<Map<string, string>> {
  const { BoatTag } = getDb().models;
  const found = await BoatTag.findAll({ where: { boatId: { [Op.in]: boatIds }, retiredAt: null } });
  const map = new Map(found.map((t) => [t.boatId, t.token]));
  const missing = boatIds.filter((id) => !map.has(id));
  if (missing.length) {
    const created = await BoatTag.bulkCreate(
      missing.map((boatId) => ({ boatId, token: newTagToken() })),
      { ignoreDuplicates: true },
    );
    for (const t of created) map.set(t.boatId, t.token);
    if (created.length < missing.length) return ensureCurrentTags(boatIds); // a concurrent issue won: read again
  }
  return map;
}

/** Retires the current tag and issues a new one (a lost sticker); the old token stops working. */
export async function reissueTag(boatId: string): Promise<string> {
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    await models.BoatTag.update({ retiredAt: new Date() }, { where: { boatId, retiredAt: null }, transaction });
    const tag = await models.BoatTag.create({ boatId, token: newTagToken() }, { transaction });
    return tag.token;
  });
}

export type TagLookup =
  { state: 'current'; boatId: string } | { state: 'retired'; boatId: string; retiredAt: Date } | { state: 'unknown' };

/** What a scanned token refers to: a current tag, a retired one, or nothing. */
export async function lookUpTag(token: string): Promise<TagLookup> {
  if (!/^[A-Za-z0-9_-]{8,64}$/.test(token)) return { state: 'unknown' };
  const tag = await getDb().models.BoatTag.findOne({ where: { token } });
  if (!tag) return { state: 'unknown' };
  return tag.retiredAt
    ? { state: 'retired', boatId: tag.boatId, retiredAt: tag.retiredAt }
    : { state: 'current', boatId: tag.boatId };
}
