'use client';

import { useId, useState } from 'react';
import { useRouter } from 'next/navigation';
import type { GearFacts } from '@/lib/core/crew/assess-crew';
import type { CrewMemberView } from '@/lib/server/crew/crew-data';
import {
  BOAT_GEAR_KINDS,
  CREW_LIMITS,
  CREW_ROLE_LABELS,
  CREW_ROLES,
  GEAR_DATE_KIND_LABELS,
  GEAR_DATE_KINDS,
  GEAR_KIND_LABELS,
  GEAR_STANDARD_HINTS,
  PERSONAL_GEAR_KINDS,
  type CrewRole,
  type GearKind,
} from '@/lib/core/crew/crew-terms';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FieldErrors, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

type Gear = { id?: string; kind: GearKind; standard: string; serial: string; dateKind: string; dueOn: string };
type Member = {
  id?: string;
  role: CrewRole;
  name: string;
  isEntrant: boolean;
  bornOn: string;
  licenceIssuedBy: string;
  licenceGrade: string;
  licenceNumber: string;
  licenceExpiresOn: string;
  medicalExpiresOn: string;
  guardianName: string;
  guardianConsentOn: string;
  gear: Gear[];
};

const fromFacts = (m: CrewMemberView): Member => ({
  id: m.id,
  role: m.role,
  name: m.name,
  isEntrant: m.hasAccount,
  bornOn: m.bornOn ?? '',
  licenceIssuedBy: m.licence?.issuedBy ?? '',
  licenceGrade: m.licence?.grade ?? '',
  licenceNumber: m.licence?.number ?? '',
  licenceExpiresOn: m.licence?.expiresOn ?? '',
  medicalExpiresOn: m.medicalExpiresOn ?? '',
  guardianName: m.guardian?.name ?? '',
  guardianConsentOn: m.guardian?.consentOn ?? '',
  gear: m.gear.map(({ id, kind, standard, serial, dateKind, dueOn }) => ({
    id,
    kind,
    standard,
    serial,
    dateKind,
    dueOn,
  })),
});

const blankGear = (kind: GearKind): Gear => ({ kind, standard: '', serial: '', dateKind: 'expires', dueOn: '' });
const blankMember = (role: CrewRole): Member => ({
  role,
  name: '',
  isEntrant: false,
  bornOn: '',
  licenceIssuedBy: '',
  licenceGrade: '',
  licenceNumber: '',
  licenceExpiresOn: '',
  medicalExpiresOn: '',
  guardianName: '',
  guardianConsentOn: '',
  gear: [blankGear('helmet')],
});

// Blank optional groups are sent as null; a partly filled one is sent as typed, so the server names the gap.
const orNull = (...values: string[]) => values.every((v) => v.trim() === '');
function toBody(members: Member[], boatGear: Gear[]) {
  const gear = (g: Gear) => ({ ...(g.id && { id: g.id }), ...g });
  return {
    members: members.map((m) => ({
      ...(m.id && { id: m.id }),
      role: m.role,
      name: m.name,
      isEntrant: m.isEntrant,
      bornOn: m.bornOn,
      licence: orNull(m.licenceIssuedBy, m.licenceGrade, m.licenceNumber, m.licenceExpiresOn)
        ? null
        : {
            issuedBy: m.licenceIssuedBy,
            grade: m.licenceGrade,
            number: m.licenceNumber,
            expiresOn: m.licenceExpiresOn,
          },
      medicalExpiresOn: m.medicalExpiresOn || null,
      guardian: orNull(m.guardianName, m.guardianConsentOn)
        ? null
        : { name: m.guardianName, consentOn: m.guardianConsentOn },
      gear: m.gear.map(gear),
    })),
    boatGear: boatGear.map(gear),
  };
}

function Field({
  id,
  label,
  value,
  onChange,
  error,
  type = 'text',
  hint,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  type?: 'text' | 'date';
  hint?: string;
}) {
  const describedBy = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input
        id={id}
        type={type}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className="field-input"
      />
      {hint && (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

function GearRows({
  prefix,
  path,
  items,
  kinds,
  errors,
  onChange,
}: {
  prefix: string;
  path: string;
  items: Gear[];
  kinds: readonly GearKind[];
  errors: FieldErrors;
  onChange: (items: Gear[]) => void;
}) {
  const set = (i: number, patch: Partial<Gear>) => onChange(items.map((g, j) => (j === i ? { ...g, ...patch } : g)));
  return (
    <div className="space-y-2">
      {items.map((g, i) => {
        const id = `${prefix}-${i}`;
        const err = (f: string) => errors[`${path}.${i}.${f}`];
        return (
          <fieldset
            key={i}
            className="grid gap-2 rounded border border-paper-deep p-2 sm:grid-cols-3"
            data-testid="gear-row"
          >
            <legend className="px-1 font-bold">{GEAR_KIND_LABELS[g.kind]}</legend>
            <div>
              <label htmlFor={`${id}-kind`} className="field-label">
                Item
              </label>
              <select
                id={`${id}-kind`}
                className="field-input"
                value={g.kind}
                onChange={(e) => set(i, { kind: e.target.value as GearKind })}
              >
                {kinds.map((k) => (
                  <option key={k} value={k}>
                    {GEAR_KIND_LABELS[k]}
                  </option>
                ))}
              </select>
            </div>
            <Field
              id={`${id}-standard`}
              label="Standard"
              hint={GEAR_STANDARD_HINTS[g.kind]}
              value={g.standard}
              onChange={(v) => set(i, { standard: v })}
              error={err('standard')}
            />
            <Field
              id={`${id}-serial`}
              label="Serial"
              value={g.serial}
              onChange={(v) => set(i, { serial: v })}
              error={err('serial')}
            />
            <div>
              <label htmlFor={`${id}-datekind`} className="field-label">
                Date kind
              </label>
              <select
                id={`${id}-datekind`}
                className="field-input"
                value={g.dateKind}
                onChange={(e) => set(i, { dateKind: e.target.value })}
              >
                {GEAR_DATE_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {GEAR_DATE_KIND_LABELS[k]}
                  </option>
                ))}
              </select>
            </div>
            <Field
              id={`${id}-due`}
              type="date"
              label={GEAR_DATE_KIND_LABELS[g.dateKind as keyof typeof GEAR_DATE_KIND_LABELS] ?? 'Date'}
              value={g.dueOn}
              onChange={(v) => set(i, { dueOn: v })}
              error={err('dueOn')}
            />
            <div className="flex items-end">
              <button type="button" className="btn-secondary" onClick={() => onChange(items.filter((_, j) => j !== i))}>
                Remove this item
              </button>
            </div>
          </fieldset>
        );
      })}
      {items.length < (kinds === BOAT_GEAR_KINDS ? CREW_LIMITS.boatGear : CREW_LIMITS.gearPerMember) && (
        <button type="button" className="btn-secondary" onClick={() => onChange([...items, blankGear(kinds[0])])}>
          Add an item
        </button>
      )}
    </div>
  );
}

/** The entrant's form for the people on an entry and their dated gear (sent whole; items keep their ids). */
export function CrewForm({
  entryId,
  members: initialMembers,
  boatGear: initialBoatGear,
}: {
  entryId: string;
  members: CrewMemberView[];
  boatGear: GearFacts[];
}) {
  const uid = useId();
  const router = useRouter();
  const [members, setMembers] = useState<Member[]>(() =>
    initialMembers.length ? initialMembers.map(fromFacts) : [blankMember('driver')],
  );
  const [boatGear, setBoatGear] = useState<Gear[]>(() =>
    initialBoatGear.map(({ id, kind, standard, serial, dateKind, dueOn }) => ({
      id,
      kind,
      standard,
      serial,
      dateKind,
      dueOn,
    })),
  );
  const { state, isPending, form } = useFormAction<(FormState & { fieldErrors?: FieldErrors }) | null>(async () => {
    const answer = await requestJson(`/api/entries/${entryId}/crew`, {
      method: 'PUT',
      body: toBody(members, boatGear),
    });
    if (!answer.ok) return refusalState(answer);
    router.refresh();
    return { ok: true, message: 'Saved: the crew and gear above are up to date.' };
  }, null);
  const errors = state?.fieldErrors ?? {};
  const setMember = (i: number, patch: Partial<Member>) =>
    setMembers(members.map((m, j) => (j === i ? { ...m, ...patch } : m)));
  return (
    <form {...form} className="space-y-3 pt-2" data-testid="crew-form">
      {members.map((m, i) => {
        const id = `${uid}-m${i}`;
        const err = (f: string) => errors[`members.${i}.${f}`];
        return (
          <fieldset key={i} className="space-y-2 rounded-lg border border-paper-deep p-3" data-testid="crew-member">
            <legend className="px-1 font-bold">
              {CREW_ROLE_LABELS[m.role]} {m.name}
            </legend>
            <div className="grid gap-2 sm:grid-cols-3">
              <div>
                <label htmlFor={`${id}-role`} className="field-label">
                  Role
                </label>
                <select
                  id={`${id}-role`}
                  className="field-input"
                  value={m.role}
                  onChange={(e) => setMember(i, { role: e.target.value as CrewRole })}
                >
                  {CREW_ROLES.map((r) => (
                    <option key={r} value={r}>
                      {CREW_ROLE_LABELS[r]}
                    </option>
                  ))}
                </select>
                {err('role') && <p className="field-error">{err('role')}</p>}
              </div>
              <Field
                id={`${id}-name`}
                label="Name"
                value={m.name}
                onChange={(v) => setMember(i, { name: v })}
                error={err('name')}
              />
              <Field
                id={`${id}-born`}
                type="date"
                label="Date of birth"
                value={m.bornOn}
                onChange={(v) => setMember(i, { bornOn: v })}
                error={err('bornOn')}
              />
            </div>
            <label className="flex items-center gap-2">
              <input
                type="checkbox"
                checked={m.isEntrant}
                onChange={(e) => setMember(i, { isEntrant: e.target.checked })}
              />
              This is me (my account)
            </label>
            <div className="grid gap-2 sm:grid-cols-4">
              <Field
                id={`${id}-lbody`}
                label="Licence issued by"
                value={m.licenceIssuedBy}
                onChange={(v) => setMember(i, { licenceIssuedBy: v })}
                error={err('licence.issuedBy') ?? err('licence')}
              />
              <Field
                id={`${id}-lgrade`}
                label="Licence grade"
                value={m.licenceGrade}
                onChange={(v) => setMember(i, { licenceGrade: v })}
                error={err('licence.grade')}
              />
              <Field
                id={`${id}-lnumber`}
                label="Licence number"
                value={m.licenceNumber}
                onChange={(v) => setMember(i, { licenceNumber: v })}
                error={err('licence.number')}
              />
              <Field
                id={`${id}-lexp`}
                type="date"
                label="Licence expires on"
                value={m.licenceExpiresOn}
                onChange={(v) => setMember(i, { licenceExpiresOn: v })}
                error={err('licence.expiresOn')}
              />
            </div>
            <div className="grid gap-2 sm:grid-cols-3">
              <Field
                id={`${id}-medical`}
                type="date"
                label="Medical certificate expires on"
                value={m.medicalExpiresOn}
                onChange={(v) => setMember(i, { medicalExpiresOn: v })}
                error={err('medicalExpiresOn')}
              />
              <Field
                id={`${id}-gname`}
                label="Parent or guardian (under 18)"
                value={m.guardianName}
                onChange={(v) => setMember(i, { guardianName: v })}
                error={err('guardian.name') ?? err('guardian')}
              />
              <Field
                id={`${id}-gdate`}
                type="date"
                label="Consent signed on"
                value={m.guardianConsentOn}
                onChange={(v) => setMember(i, { guardianConsentOn: v })}
                error={err('guardian.consentOn')}
              />
            </div>
            <GearRows
              prefix={`${id}-g`}
              path={`members.${i}.gear`}
              items={m.gear}
              kinds={PERSONAL_GEAR_KINDS}
              errors={errors}
              onChange={(gear) => setMember(i, { gear })}
            />
            <button
              type="button"
              className="btn-secondary"
              onClick={() => setMembers(members.filter((_, j) => j !== i))}
            >
              Remove {m.name || 'this person'}
            </button>
          </fieldset>
        );
      })}
      {members.length < CREW_LIMITS.members && (
        <button
          type="button"
          className="btn-secondary"
          onClick={() => setMembers([...members, blankMember('reserve')])}
        >
          Add a person
        </button>
      )}
      <fieldset className="space-y-2 rounded-lg border border-paper-deep p-3">
        <legend className="px-1 font-bold">The boat’s gear</legend>
        <GearRows
          prefix={`${uid}-b`}
          path="boatGear"
          items={boatGear}
          kinds={BOAT_GEAR_KINDS}
          errors={errors}
          onChange={setBoatGear}
        />
      </fieldset>
      <FormMessage state={state} testId="crew-form-message" />
      <button type="submit" className="btn-primary" disabled={isPending}>
        {isPending ? 'Saving…' : 'Save the crew and gear'}
      </button>
    </form>
  );
}
