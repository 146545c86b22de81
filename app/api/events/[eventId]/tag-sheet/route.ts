// GET /api/events/:eventId/tag-sheet?sheet=a4-2x7|letter-2x5&classId=: the PDF of QR tag labels.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { AppError } from '@/lib/core/errors';
import { printTagSheet, type SheetFormat } from '@/lib/server/tags/print-tag-sheet';

const SHEETS: SheetFormat[] = ['a4-2x7', 'letter-2x5'];

export const GET = actorHandler<{ eventId: string }>(async (req, { actor, params }) => {
  const sheet = (req.nextUrl.searchParams.get('sheet') ?? 'a4-2x7') as SheetFormat;
  if (!SHEETS.includes(sheet))
    throw new AppError('invalid_input', 400, `sheet: choose ${SHEETS.join(' or ')}.`, [
      { field: 'sheet', message: `Choose ${SHEETS.join(' or ')}.` },
    ]);
  const classParam = req.nextUrl.searchParams.get('classId');
  const { pdf, fileName } = await printTagSheet(actor, parseId(params.eventId, 'event'), {
    sheet,
    classId: classParam ? parseId(classParam, 'class') : undefined,
  });
  return new Response(Buffer.from(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="${fileName}"`,
      'x-content-type-options': 'nosniff',
    },
  });
});
