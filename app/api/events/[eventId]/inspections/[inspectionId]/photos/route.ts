// POST /api/events/:eventId/inspections/:inspectionId/photos: attach photos (multipart "photo", up to 8 MB each; the dock sends one per request; optional "sealNumber": the seal it shows).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { readPhotoUpload } from '@/lib/server/inspections/read-photo-upload';
import { addInspectionPhotos } from '@/lib/server/inspections/add-inspection-photos';
import { refuseChange } from '@/lib/server/inspections/refuse-change';

type P = { eventId: string; inspectionId: string };

// Permission first, so nobody else's upload is read at all; then size before any byte is read.
export const POST = withPermission<P>('inspection.record', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  const inspectionId = parseId(params.inspectionId, 'inspection');
  const upload = await readPhotoUpload(req);
  const photos = await addInspectionPhotos(actor, eventId, inspectionId, upload.photos, {
    sealNumber: upload.sealNumber,
  });
  return Response.json({ data: photos }, { status: 201 });
});

export const PUT = refuseChange('POST');
export const PATCH = refuseChange('POST');
export const DELETE = refuseChange('POST');
