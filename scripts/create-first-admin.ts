// The first site administrator of a real install (npm run serve), created at a prompt on the
// console of the machine that runs it: nothing on the network can do this, and there is no link
// to leak. Does nothing once any administrator exists. Reads name, e-mail and password from the
// terminal (the password is not echoed) or, for scripted installs, as three lines on stdin.
// Refuses a database that holds the demo's accounts (their password is public).
import readline from 'node:readline';
import { hashPassword } from '../lib/server/auth/passwords';
import pg from 'pg';
import { SignUpInput } from '../lib/core/inputs/auth';

const DEMO_ACCOUNTS = "email like '%@tarnwater.example' or email = 'admin@boreline.example'";

async function main() {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    const demo = await client.query(`select count(*)::int as n from users where ${DEMO_ACCOUNTS}`);
    if (demo.rows[0].n > 0) {
      console.error(
        '[boreline] this database holds the demo accounts, whose password is public: a real install needs its own database (npm run serve makes one in .data/pg-serve).',
      );
      process.exit(1);
    }
    if ((await client.query('select 1 from users where is_admin limit 1')).rowCount) return;

    const interactive = Boolean(process.stdin.isTTY);
    console.log('\n[boreline] No site administrator yet. Create the first one here (only this console can).');
    const input = await prompt(['Name: ', 'E-mail: ', 'Password (at least 10 characters, not shown): '], interactive);
    if (!input) {
      console.error(
        '[boreline] no administrator was created (no answers on the console): run npm run serve in a terminal once.',
      );
      process.exit(1);
    }
    const parsed = SignUpInput.safeParse({ name: input[0], email: input[1], password: input[2] });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) console.error(`  - ${issue.path.join('.')}: ${issue.message}`);
      console.error('[boreline] no administrator was created; run npm run serve again.');
      process.exit(1);
    }
    const { name, email, password } = parsed.data;
    const hash = await hashPassword(password);
    await client.query('begin');
    // One at a time: two consoles answering at once must not make two "first" administrators.
    await client.query("select pg_advisory_xact_lock(hashtext('boreline:first-admin'))");
    if ((await client.query('select 1 from users where is_admin limit 1')).rowCount) {
      await client.query('rollback');
      console.log('[boreline] an administrator was created meanwhile; nothing changed.');
      return;
    }
    const taken = await client.query('select 1 from users where email = $1', [email]);
    if (taken.rowCount) {
      await client.query('rollback');
      console.error(
        `[boreline] ${email} already has an account; no administrator was created. Choose another address.`,
      );
      process.exit(1);
    }
    await client.query(
      'insert into users (name, email, password_hash, email_verified, is_admin) values ($1, $2, $3, now(), true)',
      [name, email, hash],
    );
    await client.query('commit');
    console.log(`[boreline] site administrator ${email} created: sign in with that address and password.`);
  } finally {
    await client.end();
  }
}

/** One answer per question; null when the input ends first. */
async function prompt(questions: string[], interactive: boolean): Promise<string[] | null> {
  const rl = readline.createInterface({ input: process.stdin, output: process.stdout, terminal: interactive });
  const answers: string[] = [];
  let muted = false;
  if (interactive) {
    const out = rl as unknown as { _writeToOutput: (s: string) => void; output: NodeJS.WriteStream };
    out._writeToOutput = (s: string) => {
      if (!muted || s.includes('\n')) out.output.write(muted ? '\n' : s);
    };
  }
  const lines = rl[Symbol.asyncIterator]();
  for (const [i, q] of questions.entries()) {
    process.stdout.write(q);
    muted = interactive && i === questions.length - 1;
    const next = await lines.next();
    if (next.done) {
      rl.close();
      return null;
    }
    answers.push(String(next.value));
  }
  rl.close();
  if (!interactive) process.stdout.write('\n');
  return answers;
}

main().catch((err) => {
  console.error('[boreline] could not create the first administrator:', err instanceof Error ? err.message : err);
  process.exit(1);
});
