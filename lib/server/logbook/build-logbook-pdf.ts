import 'server-only';
import type { Actor } from '@/lib/server/auth/actor';
import { buildLogbookItems, sortLogbookItems } from '@/lib/core/logbook/timeline';
import { buildLogbookPdf } from '@/lib/core/logbook/logbook-pdf';
import { loadLogbook } from './load-logbook';

/** The logbook as a PDF for printing and signing, with the same access as the page (loadLogbook decides). */
export async function buildMyLogbookPdf(
  actor: Actor | null,
  boatId: string,
): Promise<{ pdf: Uint8Array; fileName: string }> {
  const book = await loadLogbook(actor, boatId);
  const items = sortLogbookItems(buildLogbookItems(book.record, book.fallbackZone), 'oldest');
  const printedAt = new Date();
  const pdf = await buildLogbookPdf({
    record: book.record,
    items,
    printedAt,
    timeZone: book.fallbackZone,
    printedBy: actor!.name ?? actor!.email,
  });
  // A file name from the boat's name, reduced to letters, digits and dashes (never a path or a quote).
  const slug =
    book.record.boat.name
      .normalize('NFKD')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 40) || 'boat';
  return { pdf, fileName: `logbook-${slug}-${printedAt.toISOString().slice(0, 10)}.pdf` };
}
