// POST /api/accounts: an entrant signs up with name, e-mail and password.
import { publicHandler, readJson } from '@/lib/http/handler';
import { createAccount } from '@/lib/accounts/create-account';

export const POST = publicHandler(async (req) => {
  const account = await createAccount(await readJson(req));
  return Response.json({ data: account }, { status: 201 });
});
