// POST /api/events/:eventId/instruments/:instrumentId/certificates: the chief scrutineer adds a calibration certificate (multipart: number, laboratory, calibratedOn, dueOn, expandedUncertainty, coverageFactor, file).
import { withPermission } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { addCalibrationCertificate } from '@/lib/server/inspections/add-calibration-certificate';

type P = { eventId: string; instrumentId: string };

// Permission first, so nobody else's upload is read at all.
export const POST = withPermission<P>('instrument.manage', async (req, { actor, params }) => {
  const certificate = await addCalibrationCertificate(
    actor,
    parseId(params.eventId, 'event'),
    parseId(params.instrumentId, 'instrument'),
    req,
  );
  return Response.json({ data: certificate }, { status: 201 });
});
