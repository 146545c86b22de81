import 'server-only';
import type { ClassRuleVersion, RaceClass } from '@/models';
import type { ClassRules } from '@/lib/core/inputs/class-rules';

export type RuleVersionDto = {
  id: string;
  classId: string;
  version: number;
  status: 'draft' | 'published';
  rules: ClassRules;
  changeNote: string;
  effectiveFrom: string | null;
  publishedAt: string | null;
};

export type ClassDto = {
  id: string;
  eventId: string;
  name: string;
  code: string;
  description: string;
  copiedFromId: string | null;
};

export const toRuleVersionDto = (v: ClassRuleVersion): RuleVersionDto => ({
  id: v.id,
  classId: v.classId,
  version: v.version,
  status: v.status,
  rules: v.rules,
  changeNote: v.changeNote,
  effectiveFrom: v.effectiveFrom ? v.effectiveFrom.toISOString() : null,
  publishedAt: v.publishedAt ? v.publishedAt.toISOString() : null,
});

export const toClassDto = (c: RaceClass): ClassDto => ({
  id: c.id,
  eventId: c.eventId,
  name: c.name,
  code: c.code,
  description: c.description,
  copiedFromId: c.copiedFromId ?? null,
});
