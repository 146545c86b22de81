// `npm run verify -- <bundle>`: checks an export bundle of the record chain offline (every row hash,
// link, file SHA-256 and checkpoint signature; lib/core/chain/verify-bundle.ts) and names the first
// record where anything differs. Exit code 0 when everything holds, 1 when something differs, 2 on usage.
// `--key <fingerprint>`: the key fingerprint printed on the meeting's published pages; a bundle signed with any
// other key is refused (without it, the fingerprint is printed for you to compare).
import fs from 'node:fs';
import { verifyBundle } from '../lib/core/chain/verify-bundle';

async function main() {
  const args = process.argv.slice(2);
  const k = args.indexOf('--key');
  const expectedFingerprint = k >= 0 ? args[k + 1] : null;
  if (k >= 0) args.splice(k, 2);
  const file = args[0];
  if (!file || (k >= 0 && !/^[0-9a-f:\s]{64,95}$/i.test(expectedFingerprint ?? ''))) {
    console.error('usage: npm run verify -- <bundle file> [--key <published key fingerprint, 64 hex digits>]');
    process.exit(2);
  }
  let text: string;
  try {
    text = fs.readFileSync(file, 'utf8');
  } catch (err) {
    console.error(`cannot read ${file}: ${(err as Error).message}`);
    process.exit(2);
  }
  const result = await verifyBundle(text, { expectedFingerprint });
  if (!result.ok) {
    const p = result.problem;
    console.log(`NOT VERIFIED (${p.kind}, line ${p.line}): ${p.message}`);
    if (p.record) console.log(`first record that differs: seq ${p.record.seq}, ${p.record.table} ${p.record.rowId}`);
    process.exit(1);
  }
  console.log(
    `VERIFIED chain ${result.chain}: ${result.records} records (${result.withheld} withheld), ${result.files} files`,
  );
  console.log(
    expectedFingerprint
      ? `public key fingerprint: ${result.fingerprint} (the published one)`
      : `public key fingerprint (compare with the published one, or pass it with --key): ${result.fingerprint}`,
  );
  for (const c of result.checkpoints)
    console.log(`checkpoint ${c.signedAt}: ${c.count} records, head ${c.head} (${c.reason})`);
}

void main();
