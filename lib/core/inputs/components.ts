import { z } from 'zod';
import { isSingleLine } from '@/lib/core/inputs/text-safety';
import { COMPONENT_KIND_VALUES } from './component-kinds';

// A component with identity (an engine, jet pump or impeller), shared by the boat page's forms and
// the components API. Kind and serial number are its identity and never change once registered.

export { COMPONENT_KIND_VALUES, COMPONENT_KIND_LABELS } from './component-kinds';

const text = (what: string, max: number) =>
  z
    .string({ error: `Enter ${what} as text.` })
    .trim()
    .max(max, `Keep ${what} under ${max} characters.`);

// One line, in Unicode's compatibility form (NFKC: a full-width "Ｔ" is "T"), without invisible format
// characters (zero-width spaces and joiners, Unicode category Cf) and with inner runs of white space as
// one space: "Tarnmoor  Engines" and "Tarn\u200Bmoor Engines" are "Tarnmoor Engines", one maker.
const oneLine = (what: string, max: number) =>
  text(what, max)
    .refine(isSingleLine, `Type ${what} on one line.`)
    .transform((v) =>
      v
        .normalize('NFKC')
        .replace(/\p{Cf}/gu, '')
        .replace(/\s+/g, ' ')
        .trim(),
    );
const maker = oneLine('the maker', 80);
const model = oneLine('the model', 80);
const trimCode = text('the trim code', 40);
const notes = text('the notes', 1000);

/** POST /api/boats/:boatId/components: register a component fitted to this boat. */
export const RegisterComponentInput = z.strictObject({
  kind: z.enum(COMPONENT_KIND_VALUES, { error: 'Choose engine, jet pump or impeller.' }),
  maker: maker.default(''),
  model: model.default(''),
  // As stamped on the part: letters and digits with the separators makers use; no spaces at the ends.
  // Makers stamp serials in Latin letters and Arabic digits (common practice, no source). In NFKC first,
  // so a full-width "１" is "1"; a look-alike from another script (Cyrillic "А" for "A") is refused, so
  // one stamped serial cannot be registered twice in letters that read the same.
  serialNumber: z
    .string({ error: 'Enter the serial number.' })
    .overwrite((v) => v.normalize('NFKC').trim())
    .min(1, { error: 'Enter the serial number as stamped on the part.', abort: true })
    .max(80, 'Keep the serial number under 80 characters.')
    .refine(
      (v) => /^[A-Za-z0-9](?:[A-Za-z0-9 ./_-]*[A-Za-z0-9])?$/.test(v),
      'Type the serial number as stamped: Latin letters A–Z and digits 0–9, with spaces, dots, slashes, hyphens or underscores between them.',
    ),
  trimCode: trimCode.default(''),
  notes: notes.default(''),
});
export type RegisterComponentInput = z.input<typeof RegisterComponentInput>;

/** PATCH /api/components/:componentId: maker, model, trim code and notes (never kind or serial). */
export const EditComponentInput = z
  .strictObject(
    {
      maker: maker.optional(),
      model: model.optional(),
      trimCode: trimCode.optional(),
      notes: notes.optional(),
    },
    {
      error: (iss) =>
        iss.code === 'unrecognized_keys'
          ? `Only maker, model, trim code and notes can change (not ${iss.keys.join(', ')}): a component’s kind and serial number are its identity; register a different part as a new component.`
          : undefined,
    },
  )
  .refine((v) => Object.values(v).some((x) => x !== undefined), {
    message: 'Send at least one of maker, model, trim code or notes to change.',
  });
export type EditComponentInput = z.input<typeof EditComponentInput>;

/** POST /api/components/:componentId/move: onto one of the actor's boats, or off any boat (null). */
export const MoveComponentInput = z.strictObject({
  boatId: z.uuid({ error: 'Choose one of your boats, or “on no boat”.' }).nullable(),
  /** Where the mover saw it (null: on no boat); a component that has moved since is refused. */
  fromBoatId: z.uuid({ error: 'Send where the component was seen as a boat id, or null.' }).nullable().optional(),
});
export type MoveComponentInput = z.input<typeof MoveComponentInput>;
