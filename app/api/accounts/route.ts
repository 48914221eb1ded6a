import { createAccount } from '@/lib/auth/accounts';
import { signUpSchema } from '@/lib/auth/schemas';
import { route } from '@/lib/http/route';
import { SIGN_UP_PER_ADDRESS, clientAddress, consumeOrThrow } from '@/lib/rate-limit';

// POST /api/accounts – sign up with e-mail and password
export const POST = route({ access: 'public', body: signUpSchema }, async ({ req, body }) => {
  await consumeOrThrow(SIGN_UP_PER_ADDRESS, clientAddress(req.headers));
  // A new and a taken address get the same answer; the owner of a taken one is e-mailed instead.
  await createAccount(body);
  return {
    message:
      'Thanks. If this address is new, your account is ready and you can sign in; if it already has an account, we have e-mailed its owner.',
  };
});
