import 'server-only';
import { can, type Actor } from '@/lib/server/auth/actor';
import { openEventPageWithHeading } from '@/lib/server/auth/page-access';

// Who may open each page of a meeting's inspection. Each page's layout calls its opener before the
// page's loading.tsx streams anything (so a 404 or a redirect keeps its status), the page calls it
// again for its data: one decision per request (page-access.ts caches it).
type Params = Promise<{ eventId: string }>;

/** A board-only official who opens the dock lands on the board instead. */
const boardInsteadOfDock = (actor: Actor, eventId: string) =>
  can(actor, 'inspection.board', { eventId }) ? `/inspect/${eventId}/board` : '/not-allowed';

export const openDock = (params: Params) =>
  openEventPageWithHeading(params, 'inspection.record', { deniedTo: boardInsteadOfDock });
export const openBoard = (params: Params) => openEventPageWithHeading(params, 'inspection.board');
export const openCustody = (params: Params) => openEventPageWithHeading(params, 'custody.view');
export const openInstruments = (params: Params) => openEventPageWithHeading(params, 'inspection.board');
export const openSeals = (params: Params) => openEventPageWithHeading(params, 'inspection.board');
export const openStartList = (params: Params) => openEventPageWithHeading(params, 'start_list.view');
export const openQueue = (params: Params) => openEventPageWithHeading(params, 'inspection.board');
export const openSlots = (params: Params) => openEventPageWithHeading(params, 'inspection.board');
export const openIncidents = (params: Params) => openEventPageWithHeading(params, 'incident.view');
export const openReports = (params: Params) => openEventPageWithHeading(params, 'technical_report.file');
