// POST /api/events/:eventId/incidents/:incidentId/photos: attach photos to an incident (multipart "photo", up to 8 MB each).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { readPhotoUpload } from '@/lib/server/inspections/read-photo-upload';
import { addIncidentPhotos } from '@/lib/server/incidents/add-incident-photos';

type P = { eventId: string; incidentId: string };

// Permission first, so nobody else's upload is read at all; then size before any byte is read.
export const POST = withPermission<P>('incident.record', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  const incidentId = parseId(params.incidentId, 'incident');
  const upload = await readPhotoUpload(req);
  return Response.json({ data: await addIncidentPhotos(actor, eventId, incidentId, upload.photos) }, { status: 201 });
});
