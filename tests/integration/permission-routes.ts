// Every route handler and method, with who may call it. Event-scoped rows name permissions from
// lib/core/auth/permissions.ts, so the expectations follow the one table. Paths use the ids the matrix
// test prepares (the demo meeting, the demo entrant's boat and entry, a scratch class).
import type { Permission } from '../../lib/core/auth/permissions';

export type Ids = {
  eventId: string;
  classId: string;
  entryId: string;
  spareEntryId: string;
  boatId: string;
  tagToken: string;
  raceNumber: number;
  documentId: string;
  missingId: string;
  protestId: string;
  evidenceId: string; // lodged by the demo entrant against the other entrant's entry
  componentId: string; // an impeller on the demo entrant's spare boat
  appealId: string; // lodged by the demo entrant (the protester) against a penalty on the other entrant's boat
  seriesId: string; // a series with its own secretary and steward
  seriesClassId: string;
};
export type Access =
  | 'public' // anyone, signed in or not
  | 'signed-in' // anyone signed in
  | 'owner' // the demo entrant's own boat or entry; others get 403/404
  | 'owner-or-view-all' // the owner, or officials with entry.view_all at a meeting the boat is entered in
  | 'webhook' // signature-checked, no session: refused for its signature, never 401/403
  | 'method-not-allowed' // append-only records: 405 for everyone
  | 'skip' // next-auth's own endpoints, covered by tests/integration/auth.test.ts
  | { anyOf: Permission[] } // any of these permissions at the demo meeting
  | { custom: readonly string[] } // the listed actors only
  | { ownerOr: Permission[] } // the owner, or any of these permissions at the demo meeting; others 403/404
  // A protest: 'view' for its parties (lodger, protested entrant) and protest.view_all; 'add-evidence'
  // for the parties and protest.decide; 'decide' for protest.decide; 'pay' for the lodger. Those who
  // may see the protest but not take the step get 403; everyone else 404, as for a missing id.
  | { protest: 'view' | 'add-evidence' | 'decide' | 'pay' }
  // An appeal: 'view' for its parties (appellant, penalised entrant), the meeting's protest.view_all and the
  // appeal body; 'pay' for the appellant; 'hear' for appeal.hear. Those who see it but may not take the
  // step get 403; everyone else 404, as for a missing id.
  | { appeal: 'view' | 'pay' | 'hear' }
  // Any of these permissions in the matrix's series (roles scoped to the series, and those above any meeting).
  | { series: Permission[] };

type Row = {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  file: string;
  path: (i: Ids) => string;
  access: Access;
};

const E = 'app/api/events/[eventId]';
const ev = (i: Ids) => `/api/events/${i.eventId}`;

export const ROUTES: Row[] = [
  { method: 'GET', file: 'app/api/auth/[...nextauth]/route.ts', path: () => '/api/auth/session', access: 'skip' },
  { method: 'POST', file: 'app/api/auth/[...nextauth]/route.ts', path: () => '/api/auth/signout', access: 'skip' },
  { method: 'GET', file: 'app/api/health/route.ts', path: () => '/api/health', access: 'public' },
  // The installed app's service worker (build file names only).
  { method: 'GET', file: 'app/boreline-sw.js/route.ts', path: () => '/boreline-sw.js', access: 'public' },
  { method: 'GET', file: 'app/api/health/live/route.ts', path: () => '/api/health/live', access: 'public' },
  { method: 'GET', file: 'app/api/health/ready/route.ts', path: () => '/api/health/ready', access: 'public' },
  {
    method: 'GET',
    file: 'app/api/metrics/route.ts',
    path: () => '/api/metrics',
    access: { anyOf: ['admin.view_metrics'] },
  },
  { method: 'POST', file: 'app/api/accounts/route.ts', path: () => '/api/accounts', access: 'public' },
  { method: 'POST', file: 'app/api/payments/webhook/route.ts', path: () => '/api/payments/webhook', access: 'webhook' },
  // Public calculation API and published reports
  {
    method: 'POST',
    file: 'app/api/v1/jet-performance/route.ts',
    path: () => '/api/v1/jet-performance',
    access: 'public',
  },
  {
    method: 'POST',
    file: 'app/api/v1/jet-performance/crossover/route.ts',
    path: () => '/api/v1/jet-performance/crossover',
    access: 'public',
  },
  {
    method: 'POST',
    file: 'app/api/v1/jet-performance/matched/route.ts',
    path: () => '/api/v1/jet-performance/matched',
    access: 'public',
  },
  { method: 'POST', file: 'app/api/v1/conformity/route.ts', path: () => '/api/v1/conformity', access: 'public' },
  { method: 'GET', file: 'app/api/v1/openapi.json/route.ts', path: () => '/api/v1/openapi.json', access: 'public' },
  {
    method: 'GET',
    file: 'app/api/reports/[publicId]/route.ts',
    path: () => '/api/reports/unknownreport1',
    access: 'public',
  },
  {
    method: 'GET',
    file: 'app/api/reports/[publicId]/pdf/route.ts',
    path: () => '/api/reports/unknownreport1/pdf',
    access: 'public',
  },
  {
    method: 'GET',
    file: 'app/api/reports/[publicId]/csv/route.ts',
    path: () => '/api/reports/unknownreport1/csv',
    access: 'public',
  },
  // Entrant: own boats, documents, entries
  { method: 'GET', file: 'app/api/boats/route.ts', path: () => '/api/boats', access: 'signed-in' },
  { method: 'POST', file: 'app/api/boats/route.ts', path: () => '/api/boats', access: 'signed-in' },
  { method: 'GET', file: 'app/api/boats/[boatId]/route.ts', path: (i) => `/api/boats/${i.boatId}`, access: 'owner' },
  { method: 'PATCH', file: 'app/api/boats/[boatId]/route.ts', path: (i) => `/api/boats/${i.boatId}`, access: 'owner' },
  {
    method: 'PUT',
    file: 'app/api/boats/[boatId]/performance/route.ts',
    path: (i) => `/api/boats/${i.boatId}/performance`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: 'app/api/boats/[boatId]/documents/route.ts',
    path: (i) => `/api/boats/${i.boatId}/documents`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: 'app/api/boats/[boatId]/tag-pdf/route.ts',
    path: (i) => `/api/boats/${i.boatId}/tag-pdf`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: 'app/api/boats/[boatId]/tag/route.ts',
    path: (i) => `/api/boats/${i.boatId}/tag`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: 'app/api/boats/[boatId]/components/route.ts',
    path: (i) => `/api/boats/${i.boatId}/components`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: 'app/api/boats/[boatId]/components/route.ts',
    path: (i) => `/api/boats/${i.boatId}/components`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: 'app/api/components/[componentId]/route.ts',
    path: (i) => `/api/components/${i.componentId}`,
    access: 'owner',
  },
  {
    method: 'PATCH',
    file: 'app/api/components/[componentId]/route.ts',
    path: (i) => `/api/components/${i.componentId}`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: 'app/api/components/[componentId]/move/route.ts',
    path: (i) => `/api/components/${i.componentId}/move`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: 'app/api/boats/[boatId]/logbook/pdf/route.ts',
    path: (i) => `/api/boats/${i.boatId}/logbook/pdf`,
    access: 'owner-or-view-all',
  },
  {
    method: 'POST',
    file: 'app/api/boats/[boatId]/log-notes/route.ts',
    path: (i) => `/api/boats/${i.boatId}/log-notes`,
    access: { anyOf: ['boat.log_note'] },
  },
  {
    method: 'GET',
    file: 'app/api/documents/[documentId]/route.ts',
    path: (i) => `/api/documents/${i.documentId}`,
    access: 'owner-or-view-all',
  },
  { method: 'GET', file: 'app/api/entries/route.ts', path: () => '/api/entries', access: 'signed-in' },
  { method: 'POST', file: 'app/api/entries/route.ts', path: () => '/api/entries', access: 'signed-in' },
  {
    method: 'POST',
    file: 'app/api/entries/[entryId]/checkout/route.ts',
    path: (i) => `/api/entries/${i.spareEntryId}/checkout`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: 'app/api/entries/[entryId]/withdraw/route.ts',
    path: (i) => `/api/entries/${i.spareEntryId}/withdraw`,
    access: 'owner',
  },
  {
    method: 'PUT',
    file: 'app/api/entries/[entryId]/masses/route.ts',
    path: (i) => `/api/entries/${i.entryId}/masses`,
    access: { ownerOr: ['results.publish'] },
  },
  { method: 'GET', file: 'app/api/events/open/route.ts', path: () => '/api/events/open', access: 'signed-in' },
  // Crew and dated gear per entry (issue 21): the entrant edits; the meeting's board officials read.
  {
    method: 'GET',
    file: 'app/api/entries/[entryId]/crew/route.ts',
    path: (i) => `/api/entries/${i.entryId}/crew`,
    access: { ownerOr: ['entry.view_all', 'inspection.board'] },
  },
  {
    method: 'PUT',
    file: 'app/api/entries/[entryId]/crew/route.ts',
    path: (i) => `/api/entries/${i.entryId}/crew`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: `${E}/gear-checks/route.ts`,
    path: (i) => `${ev(i)}/gear-checks?entryId=${i.entryId}`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'POST',
    file: `${E}/gear-checks/route.ts`,
    path: (i) => `${ev(i)}/gear-checks`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'POST',
    file: `${E}/crew-sign-ons/route.ts`,
    path: (i) => `${ev(i)}/crew-sign-ons`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'PUT',
    file: `${E}/crew-requirements/route.ts`,
    path: (i) => `${ev(i)}/crew-requirements`,
    access: { anyOf: ['class.edit'] },
  },
  // Organiser
  {
    method: 'POST',
    file: 'app/api/events/route.ts',
    path: () => '/api/events',
    access: { custom: ['organiser', 'organiserElsewhere', 'admin'] },
  },
  { method: 'GET', file: `${E}/route.ts`, path: ev, access: { anyOf: ['event.edit'] } },
  { method: 'PATCH', file: `${E}/route.ts`, path: ev, access: { anyOf: ['event.edit'] } },
  { method: 'GET', file: `${E}/classes/route.ts`, path: (i) => `${ev(i)}/classes`, access: { anyOf: ['class.edit'] } },
  { method: 'POST', file: `${E}/classes/route.ts`, path: (i) => `${ev(i)}/classes`, access: { anyOf: ['class.edit'] } },
  {
    method: 'GET',
    file: `${E}/classes/[classId]/rules/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/rules`,
    access: { anyOf: ['class.edit'] },
  },
  {
    method: 'PUT',
    file: `${E}/classes/[classId]/rules/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/rules`,
    access: { anyOf: ['class.edit'] },
  },
  {
    method: 'POST',
    file: `${E}/classes/[classId]/rules/publish/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/rules/publish`,
    access: { anyOf: ['class.edit'] },
  },
  {
    method: 'GET',
    file: `${E}/classes/[classId]/report/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/report`,
    access: { anyOf: ['report.publish'] },
  },
  {
    method: 'POST',
    file: `${E}/classes/[classId]/report/publish/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/report/publish`,
    access: { anyOf: ['report.publish'] },
  },
  {
    method: 'POST',
    file: `${E}/staff/route.ts`,
    path: (i) => `${ev(i)}/staff`,
    access: { anyOf: ['event.staff_manage'] },
  },
  {
    method: 'POST',
    file: `${E}/invitations/route.ts`,
    path: (i) => `${ev(i)}/invitations`,
    access: { anyOf: ['event.staff_manage'] },
  },
  {
    method: 'GET',
    file: `${E}/entries/route.ts`,
    path: (i) => `${ev(i)}/entries`,
    access: { anyOf: ['entry.view_all'] },
  },
  {
    method: 'GET',
    file: `${E}/entries/export/route.ts`,
    path: (i) => `${ev(i)}/entries/export`,
    access: { anyOf: ['entry.view_all'] },
  },
  {
    method: 'POST',
    file: `${E}/entries/[entryId]/cancel/route.ts`,
    path: (i) => `${ev(i)}/entries/${i.entryId}/cancel`,
    access: { anyOf: ['entry.cancel'] },
  },
  {
    method: 'GET',
    file: `${E}/tag-sheet/route.ts`,
    path: (i) => `${ev(i)}/tag-sheet`,
    access: { anyOf: ['tags.print'] },
  },
  {
    method: 'GET',
    file: `${E}/pump-catalogue/route.ts`,
    path: (i) => `${ev(i)}/pump-catalogue`,
    access: 'signed-in',
  },
  {
    method: 'POST',
    file: `${E}/pump-catalogue/route.ts`,
    path: (i) => `${ev(i)}/pump-catalogue`,
    access: { anyOf: ['class.edit'] },
  },
  {
    method: 'GET',
    file: `${E}/instruments/route.ts`,
    path: (i) => `${ev(i)}/instruments`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'POST',
    file: `${E}/instruments/route.ts`,
    path: (i) => `${ev(i)}/instruments`,
    access: { anyOf: ['instrument.manage'] },
  },
  {
    method: 'POST',
    file: `${E}/instruments/[instrumentId]/retire/route.ts`,
    path: (i) => `${ev(i)}/instruments/${i.missingId}/retire`,
    access: { anyOf: ['instrument.manage'] },
  },
  {
    method: 'POST',
    file: `${E}/instruments/[instrumentId]/certificates/route.ts`,
    path: (i) => `${ev(i)}/instruments/${i.missingId}/certificates`,
    access: { anyOf: ['instrument.manage'] },
  },
  {
    method: 'GET',
    file: `${E}/instruments/[instrumentId]/certificates/[certificateId]/file/route.ts`,
    path: (i) => `${ev(i)}/instruments/${i.missingId}/certificates/${i.missingId}/file`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'POST',
    file: `${E}/instruments/[instrumentId]/checks/route.ts`,
    path: (i) => `${ev(i)}/instruments/${i.missingId}/checks`,
    access: { anyOf: ['instrument.manage'] },
  },
  // The seal register
  {
    method: 'GET',
    file: `${E}/seal-batches/route.ts`,
    path: (i) => `${ev(i)}/seal-batches`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'POST',
    file: `${E}/seal-batches/route.ts`,
    path: (i) => `${ev(i)}/seal-batches`,
    access: { anyOf: ['instrument.manage'] },
  },
  {
    method: 'GET',
    file: `${E}/seals/route.ts`,
    path: (i) => `${ev(i)}/seals`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'GET',
    file: `${E}/seals/[sealId]/route.ts`,
    path: (i) => `${ev(i)}/seals/${i.missingId}`,
    access: { anyOf: ['inspection.board'] },
  },
  // At the dock
  {
    method: 'POST',
    file: `${E}/inspections/route.ts`,
    path: (i) => `${ev(i)}/inspections`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'GET',
    file: `${E}/inspections/route.ts`,
    path: (i) => `${ev(i)}/inspections`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'PUT',
    file: `${E}/inspections/route.ts`,
    path: (i) => `${ev(i)}/inspections`,
    access: 'method-not-allowed',
  },
  {
    method: 'PATCH',
    file: `${E}/inspections/route.ts`,
    path: (i) => `${ev(i)}/inspections`,
    access: 'method-not-allowed',
  },
  {
    method: 'DELETE',
    file: `${E}/inspections/route.ts`,
    path: (i) => `${ev(i)}/inspections`,
    access: 'method-not-allowed',
  },
  {
    method: 'POST',
    file: `${E}/inspections/[inspectionId]/photos/route.ts`,
    path: (i) => `${ev(i)}/inspections/${i.missingId}/photos`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'PUT',
    file: `${E}/inspections/[inspectionId]/photos/route.ts`,
    path: (i) => `${ev(i)}/inspections/${i.missingId}/photos`,
    access: 'method-not-allowed',
  },
  {
    method: 'PATCH',
    file: `${E}/inspections/[inspectionId]/photos/route.ts`,
    path: (i) => `${ev(i)}/inspections/${i.missingId}/photos`,
    access: 'method-not-allowed',
  },
  {
    method: 'DELETE',
    file: `${E}/inspections/[inspectionId]/photos/route.ts`,
    path: (i) => `${ev(i)}/inspections/${i.missingId}/photos`,
    access: 'method-not-allowed',
  },
  {
    method: 'GET',
    file: `${E}/tags/[token]/route.ts`,
    path: (i) => `${ev(i)}/tags/${i.tagToken}`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'GET',
    file: `${E}/component-serials/[serial]/route.ts`,
    path: (i) => `${ev(i)}/component-serials/MATRIX-NO-SUCH-SERIAL`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'GET',
    file: `${E}/race-numbers/[raceNumber]/route.ts`,
    path: (i) => `${ev(i)}/race-numbers/${i.raceNumber}`,
    access: { anyOf: ['inspection.record'] },
  },
  {
    method: 'POST',
    file: `${E}/reinspections/route.ts`,
    path: (i) => `${ev(i)}/reinspections`,
    access: { anyOf: ['inspection.assign_reinspection'] },
  },
  {
    method: 'GET',
    file: `${E}/reinspections/route.ts`,
    path: (i) => `${ev(i)}/reinspections`,
    access: { anyOf: ['inspection.board', 'inspection.assign_reinspection'] },
  },
  // Scrutineering slots and the dock queue
  {
    method: 'GET',
    file: `${E}/slots/route.ts`,
    path: (i) => `${ev(i)}/slots`,
    access: { anyOf: ['inspection.board', 'schedule.manage'] },
  },
  {
    method: 'POST',
    file: `${E}/slots/route.ts`,
    path: (i) => `${ev(i)}/slots`,
    access: { anyOf: ['schedule.manage'] },
  },
  // The entry's own entrant, or the chief scrutineer (not among the matrix's actors); others: 404.
  {
    method: 'GET',
    file: `${E}/slots/entries/[entryId]/route.ts`,
    path: (i) => `${ev(i)}/slots/entries/${i.entryId}`,
    access: 'owner',
  },
  {
    method: 'POST',
    file: `${E}/slots/entries/[entryId]/route.ts`,
    path: (i) => `${ev(i)}/slots/entries/${i.entryId}`,
    access: 'owner',
  },
  {
    method: 'GET',
    file: `${E}/slots/queue/route.ts`,
    path: (i) => `${ev(i)}/slots/queue`,
    access: { anyOf: ['inspection.board'] },
  },
  {
    method: 'POST',
    file: `${E}/slots/arrivals/route.ts`,
    path: (i) => `${ev(i)}/slots/arrivals`,
    access: { anyOf: ['inspection.record'] },
  },
  // Incidents (append-only)
  {
    method: 'GET',
    file: `${E}/incidents/route.ts`,
    path: (i) => `${ev(i)}/incidents`,
    access: { anyOf: ['incident.view'] },
  },
  {
    method: 'POST',
    file: `${E}/incidents/route.ts`,
    path: (i) => `${ev(i)}/incidents`,
    access: { anyOf: ['incident.record'] },
  },
  { method: 'PUT', file: `${E}/incidents/route.ts`, path: (i) => `${ev(i)}/incidents`, access: 'method-not-allowed' },
  { method: 'PATCH', file: `${E}/incidents/route.ts`, path: (i) => `${ev(i)}/incidents`, access: 'method-not-allowed' },
  {
    method: 'DELETE',
    file: `${E}/incidents/route.ts`,
    path: (i) => `${ev(i)}/incidents`,
    access: 'method-not-allowed',
  },
  {
    method: 'POST',
    file: `${E}/incidents/[incidentId]/photos/route.ts`,
    path: (i) => `${ev(i)}/incidents/${i.missingId}/photos`,
    access: { anyOf: ['incident.record'] },
  },
  // Parts held by the officials
  {
    method: 'GET',
    file: `${E}/custody/route.ts`,
    path: (i) => `${ev(i)}/custody`,
    access: { anyOf: ['custody.view'] },
  },
  {
    method: 'POST',
    file: `${E}/custody/route.ts`,
    path: (i) => `${ev(i)}/custody`,
    access: { anyOf: ['custody.take'] },
  },
  {
    method: 'POST',
    file: `${E}/custody/[itemId]/release/route.ts`,
    path: (i) => `${ev(i)}/custody/${i.missingId}/release`,
    access: { anyOf: ['custody.release'] },
  },
  // The register of declared interests (officials of the meeting; the whole register for stewards and organiser)
  {
    method: 'GET',
    file: `${E}/interests/route.ts`,
    path: (i) => `${ev(i)}/interests`,
    access: { anyOf: ['interest.declare'] },
  },
  {
    method: 'POST',
    file: `${E}/interests/route.ts`,
    path: (i) => `${ev(i)}/interests`,
    access: { anyOf: ['interest.declare'] },
  },
  { method: 'PUT', file: `${E}/interests/route.ts`, path: (i) => `${ev(i)}/interests`, access: 'method-not-allowed' },
  { method: 'PATCH', file: `${E}/interests/route.ts`, path: (i) => `${ev(i)}/interests`, access: 'method-not-allowed' },
  {
    method: 'DELETE',
    file: `${E}/interests/route.ts`,
    path: (i) => `${ev(i)}/interests`,
    access: 'method-not-allowed',
  },
  {
    method: 'POST',
    file: `${E}/interests/[interestId]/withdraw/route.ts`,
    path: (i) => `${ev(i)}/interests/${i.missingId}/withdraw`,
    access: { anyOf: ['interest.declare'] },
  },
  // Results, protests and the audit trail
  { method: 'GET', file: `${E}/results/route.ts`, path: (i) => `${ev(i)}/results`, access: 'signed-in' },
  {
    method: 'POST',
    file: `${E}/results/route.ts`,
    path: (i) => `${ev(i)}/results`,
    access: { anyOf: ['results.publish'] },
  },
  // Penalties: the catalogue, technical delegates' reports to the stewards, the stewards' penalties
  {
    method: 'GET',
    file: `${E}/penalty-catalogue/route.ts`,
    path: (i) => `${ev(i)}/penalty-catalogue`,
    access: { anyOf: ['penalty.catalogue_manage', 'penalty.apply'] },
  },
  {
    method: 'POST',
    file: `${E}/penalty-catalogue/route.ts`,
    path: (i) => `${ev(i)}/penalty-catalogue`,
    access: { anyOf: ['penalty.catalogue_manage'] },
  },
  {
    method: 'GET',
    file: `${E}/technical-reports/route.ts`,
    path: (i) => `${ev(i)}/technical-reports`,
    access: { anyOf: ['technical_report.file', 'penalty.apply'] },
  },
  {
    method: 'POST',
    file: `${E}/technical-reports/route.ts`,
    path: (i) => `${ev(i)}/technical-reports`,
    access: { anyOf: ['technical_report.file'] },
  },
  { method: 'GET', file: `${E}/penalties/route.ts`, path: (i) => `${ev(i)}/penalties`, access: 'signed-in' },
  {
    method: 'POST',
    file: `${E}/penalties/route.ts`,
    path: (i) => `${ev(i)}/penalties`,
    access: { anyOf: ['penalty.apply'] },
  },
  // Appeals to the governing body's appeal body
  {
    method: 'POST',
    file: `${E}/appeals/route.ts`,
    path: (i) => `${ev(i)}/appeals`,
    access: { anyOf: ['appeal.lodge'] },
  },
  { method: 'GET', file: 'app/api/appeals/route.ts', path: () => '/api/appeals', access: 'signed-in' },
  {
    method: 'GET',
    file: 'app/api/appeals/[appealId]/route.ts',
    path: (i) => `/api/appeals/${i.appealId}`,
    access: { appeal: 'view' },
  },
  {
    method: 'POST',
    file: 'app/api/appeals/[appealId]/checkout/route.ts',
    path: (i) => `/api/appeals/${i.appealId}/checkout`,
    access: { appeal: 'pay' },
  },
  {
    method: 'POST',
    file: 'app/api/appeals/[appealId]/hearing/route.ts',
    path: (i) => `/api/appeals/${i.appealId}/hearing`,
    access: { appeal: 'hear' },
  },
  {
    method: 'POST',
    file: 'app/api/appeals/[appealId]/decision/route.ts',
    path: (i) => `/api/appeals/${i.appealId}/decision`,
    access: { appeal: 'hear' },
  },
  // No pass, no start: the start list of a meeting day and the organiser's decisions on it
  {
    method: 'GET',
    file: `${E}/start-list/route.ts`,
    path: (i) => `${ev(i)}/start-list`,
    access: { anyOf: ['start_list.view'] },
  },
  {
    method: 'POST',
    file: `${E}/start-list/decisions/route.ts`,
    path: (i) => `${ev(i)}/start-list/decisions`,
    access: { anyOf: ['start_list.decide'] },
  },
  // Run times from the timing sheet and the model against the clock (organisers, as results)
  {
    method: 'GET',
    file: `${E}/run-times/route.ts`,
    path: (i) => `${ev(i)}/run-times`,
    access: { anyOf: ['results.publish'] },
  },
  {
    method: 'POST',
    file: `${E}/run-times/route.ts`,
    path: (i) => `${ev(i)}/run-times`,
    access: { anyOf: ['results.publish'] },
  },
  {
    method: 'POST',
    file: `${E}/run-times/preview/route.ts`,
    path: (i) => `${ev(i)}/run-times/preview`,
    access: { anyOf: ['results.publish'] },
  },
  {
    method: 'GET',
    file: `${E}/classes/[classId]/clock/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/clock`,
    access: { anyOf: ['results.publish'] },
  },
  { method: 'GET', file: `${E}/protests/route.ts`, path: (i) => `${ev(i)}/protests`, access: 'signed-in' },
  {
    method: 'POST',
    file: `${E}/protests/route.ts`,
    path: (i) => `${ev(i)}/protests`,
    access: { anyOf: ['protest.lodge'] },
  },
  { method: 'GET', file: `${E}/audit/route.ts`, path: (i) => `${ev(i)}/audit`, access: { anyOf: ['audit.read'] } },
  {
    method: 'GET',
    file: `${E}/chain/bundle/route.ts`,
    path: (i) => `${ev(i)}/chain/bundle`,
    access: { anyOf: ['chain.export'] },
  },
  { method: 'POST', file: `${E}/audit/route.ts`, path: (i) => `${ev(i)}/audit`, access: 'method-not-allowed' },
  { method: 'PUT', file: `${E}/audit/route.ts`, path: (i) => `${ev(i)}/audit`, access: 'method-not-allowed' },
  { method: 'PATCH', file: `${E}/audit/route.ts`, path: (i) => `${ev(i)}/audit`, access: 'method-not-allowed' },
  { method: 'DELETE', file: `${E}/audit/route.ts`, path: (i) => `${ev(i)}/audit`, access: 'method-not-allowed' },
  {
    method: 'GET',
    file: 'app/api/protests/[protestId]/route.ts',
    path: (i) => `/api/protests/${i.protestId}`,
    access: { protest: 'view' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/checkout/route.ts',
    path: (i) => `/api/protests/${i.protestId}/checkout`,
    access: { protest: 'pay' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/evidence/route.ts',
    path: (i) => `/api/protests/${i.protestId}/evidence`,
    access: { protest: 'add-evidence' },
  },
  {
    method: 'GET',
    file: 'app/api/protests/[protestId]/evidence/route.ts',
    path: (i) => `/api/protests/${i.protestId}/evidence`,
    access: { protest: 'view' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/accept/route.ts',
    path: (i) => `/api/protests/${i.protestId}/accept`,
    access: { protest: 'decide' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/reject/route.ts',
    path: (i) => `/api/protests/${i.protestId}/reject`,
    access: { protest: 'decide' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/reinspection/route.ts',
    path: (i) => `/api/protests/${i.protestId}/reinspection`,
    access: { protest: 'decide' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/hearing/route.ts',
    path: (i) => `/api/protests/${i.protestId}/hearing`,
    access: { protest: 'decide' },
  },
  {
    method: 'POST',
    file: 'app/api/protests/[protestId]/decision/route.ts',
    path: (i) => `/api/protests/${i.protestId}/decision`,
    access: { protest: 'decide' },
  },
  {
    method: 'GET',
    file: 'app/api/protests/[protestId]/decision.pdf/route.ts',
    path: (i) => `/api/protests/${i.protestId}/decision.pdf`,
    access: { protest: 'view' },
  },
  // Site administration (a missing person: 400 or 404 for the administrator, 403 for everyone else)
  {
    method: 'POST',
    file: 'app/api/admin/chain/check/route.ts',
    path: () => '/api/admin/chain/check',
    access: { anyOf: ['chain.check'] },
  },
  {
    method: 'PUT',
    file: 'app/api/admin/people/[userId]/suspension/route.ts',
    path: (i) => `/api/admin/people/${i.missingId}/suspension`,
    access: { anyOf: ['admin.manage_users'] },
  },
  {
    method: 'DELETE',
    file: 'app/api/admin/people/[userId]/suspension/route.ts',
    path: (i) => `/api/admin/people/${i.missingId}/suspension`,
    access: { anyOf: ['admin.manage_users'] },
  },
  {
    method: 'PUT',
    file: 'app/api/admin/people/[userId]/appeal-body/route.ts',
    path: (i) => `/api/admin/people/${i.missingId}/appeal-body`,
    access: { anyOf: ['admin.manage_users'] },
  },
  {
    method: 'DELETE',
    file: 'app/api/admin/people/[userId]/appeal-body/route.ts',
    path: (i) => `/api/admin/people/${i.missingId}/appeal-body`,
    access: { anyOf: ['admin.manage_users'] },
  },
  {
    method: 'POST',
    file: `${E}/classes/[classId]/follow-series/route.ts`,
    path: (i) => `${ev(i)}/classes/${i.classId}/follow-series`,
    access: { anyOf: ['class.edit'] },
  },
  // Series: started by an organiser (of an organisation) or the administrator; run by its secretary
  {
    method: 'POST',
    file: 'app/api/series/route.ts',
    path: () => '/api/series',
    access: { custom: ['organiser', 'organiserElsewhere', 'admin'] },
  },
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/route.ts',
    path: (i) => `/api/series/${i.seriesId}`,
    access: 'public',
  },
  // The officials list with its open invitations: the secretary only (appointing is by invitation, POST below).
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/officials/route.ts',
    path: (i) => `/api/series/${i.seriesId}/officials`,
    access: { series: ['series.manage'] },
  },
  ...(['officials', 'classes'] as const).map((p) => ({
    method: 'POST' as const,
    file: `app/api/series/[seriesId]/${p}/route.ts`,
    path: (i: Ids) => `/api/series/${i.seriesId}/${p}`,
    access: { series: ['series.manage'] } as Access,
  })),
  ...(['rules', 'rounds', 'race-numbers'] as const).map((p) => ({
    method: 'POST' as const,
    file: `app/api/series/[seriesId]/classes/[seriesClassId]/${p}/route.ts`,
    path: (i: Ids) => `/api/series/${i.seriesId}/classes/${i.seriesClassId}/${p}`,
    access: { series: ['series.manage'] } as Access,
  })),
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/classes/[seriesClassId]/bulletins/route.ts',
    path: (i) => `/api/series/${i.seriesId}/classes/${i.seriesClassId}/bulletins`,
    access: 'public',
  },
  {
    method: 'POST',
    file: 'app/api/series/[seriesId]/classes/[seriesClassId]/bulletins/route.ts',
    path: (i) => `/api/series/${i.seriesId}/classes/${i.seriesClassId}/bulletins`,
    access: { series: ['series.bulletin_publish'] },
  },
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/classes/[seriesClassId]/standings/route.ts',
    path: (i) => `/api/series/${i.seriesId}/classes/${i.seriesClassId}/standings`,
    access: 'public',
  },
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/classes/[seriesClassId]/parity-history/route.ts',
    path: (i) => `/api/series/${i.seriesId}/classes/${i.seriesClassId}/parity-history`,
    access: { series: ['series.parity_view'] },
  },
  {
    method: 'GET',
    file: 'app/api/series/[seriesId]/exports/[file]/route.ts',
    path: (i) => `/api/series/${i.seriesId}/exports/penalties.csv`,
    access: { series: ['series.export'] },
  },
  {
    method: 'GET',
    file: 'app/api/evidence/[evidenceId]/route.ts',
    path: (i) => `/api/evidence/${i.evidenceId}`,
    access: { protest: 'view' },
  },
];

// Every server action (each export of a 'use server' file), the page it is posted to, and who may
// run it. Bodies are refused input, so an allowed call changes nothing.
export type ActionRow = {
  file: string;
  exportedName: string;
  page: string;
  access: 'signed-in';
  fields: Record<string, string>;
};
export const SERVER_ACTIONS: ActionRow[] = [
  {
    file: 'app/(app)/account/actions.ts',
    exportedName: 'changeNameAction',
    page: '/account',
    access: 'signed-in',
    fields: { name: '   ' },
  },
  {
    file: 'app/(app)/account/actions.ts',
    exportedName: 'changePasswordAction',
    page: '/account',
    access: 'signed-in',
    fields: { password: '' },
  },
  {
    file: 'app/(app)/account/actions.ts',
    exportedName: 'signOutEverywhereAction',
    page: '/account',
    access: 'signed-in',
    fields: { confirm: 'not-everywhere' },
  },
  {
    file: 'app/(app)/account/actions.ts',
    exportedName: 'resendAddressProofAction',
    page: '/account',
    access: 'signed-in',
    fields: { confirm: 'not-send' },
  },
];
