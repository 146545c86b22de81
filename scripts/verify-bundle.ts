// `npm run verify -- <bundle>`: checks an export bundle of the record chain offline (every row hash,
// link, file SHA-256 and checkpoint signature; lib/core/chain/verify-bundle.ts) and names the first
// record where anything differs. Exit code 0 when everything holds, 1 when something differs, 2 on usage.
import fs from 'node:fs';
import { verifyBundle } from '../lib/core/chain/verify-bundle';

async function main() {
  const file = process.argv[2];
  if (!file) {
    console.error('usage: npm run verify -- <bundle file>');
    process.exit(2);
  }
  let text: string;
  try {
    text = fs.readFileSync(file, 'utf8');
  } catch (err) {
    console.error(`cannot read ${file}: ${(err as Error).message}`);
    process.exit(2);
  }
  const result = await verifyBundle(text);
  if (!result.ok) {
    const p = result.problem;
    console.log(`NOT VERIFIED (${p.kind}, line ${p.line}): ${p.message}`);
    if (p.record) console.log(`first record that differs: seq ${p.record.seq}, ${p.record.table} ${p.record.rowId}`);
    process.exit(1);
  }
  console.log(
    `VERIFIED chain ${result.chain}: ${result.records} records (${result.withheld} withheld), ${result.files} files`,
  );
  console.log(`public key fingerprint (compare with the published one): ${result.fingerprint}`);
  for (const c of result.checkpoints)
    console.log(`checkpoint ${c.signedAt}: ${c.count} records, head ${c.head} (${c.reason})`);
}

void main();
