// How a signed checkpoint is printed on a published page and its PDF (issue 24, item 2): the same
// lines in both places, so a reader can compare the paper with an export bundle (`npm run verify`, /verify).
import { formatTime } from '../format/time';
import type { Checkpoint } from './bundle-format';

export function checkpointLines(c: Checkpoint, timeZone: string): string[] {
  return [
    `The meeting's record chain held ${c.count} records when this was published; its head (the last link's SHA-256) is:`,
    c.head,
    `Signed ${formatTime(c.signedAt, timeZone)} (${c.reason}) with the meeting's Ed25519 key, whose fingerprint (SHA-256 of the public key) is:`,
    c.keyFingerprint,
    'Signature (base64):',
    c.signature,
    "Check a copy of the meeting's records against these lines with the export bundle: npm run verify -- <bundle>, or the /verify page.",
  ];
}
