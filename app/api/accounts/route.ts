import { createAccount } from '@/lib/auth/accounts';
import { signUpSchema } from '@/lib/auth/schemas';
import { route } from '@/lib/http/route';
import { SIGN_UP_PER_ADDRESS, clientAddress, consumeOrThrow } from '@/lib/rate-limit';

// POST /api/accounts – sign up with e-mail and password
export const POST = route({ access: 'public', body: signUpSchema }, async ({ req, body }) => {
  await consumeOrThrow(SIGN_UP_PER_ADDRESS, clientAddress(req.headers));
  const user = await createAccount(body);
  return { user: { id: user.id, name: user.name, handle: user.handle } };
});
