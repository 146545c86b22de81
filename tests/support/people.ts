// People the integration tests make for themselves: a new account whose address is proven, signed in.
import { HttpSession } from './http-session';
import { uniqueEmail } from './env';
import { query } from './db';

export type Person = { s: HttpSession; id: string; email: string };

/** Signs up a new person (`<prefix> Tester`, a unique address), confirms the address and keeps the session. */
export async function newPerson(prefix: string, password: string): Promise<Person> {
  const s = new HttpSession();
  const email = uniqueEmail(prefix);
  await s.signUpAndConfirm({ name: `${prefix} Tester`, email, password });
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  return { s, id, email };
}
