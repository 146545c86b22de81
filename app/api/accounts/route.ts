// POST /api/accounts: an entrant signs up with name, e-mail and password; 202 and a link to confirm the address.
import { publicHandler, readJson } from '@/lib/server/http/handler';
import { getClientAddress } from '@/lib/server/http/client-address';
import { createAccount } from '@/lib/server/accounts/create-account';

export const POST = publicHandler(async (req) => {
  const answer = await createAccount(await readJson(req), getClientAddress(req.headers));
  return Response.json({ data: answer }, { status: 202 });
});
