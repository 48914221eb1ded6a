import { z } from 'zod';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { setEmailScope } from '@/lib/notifications/preferences';
import { readUnsubscribeToken } from '@/lib/notifications/unsubscribe-token';

const querySchema = z.object({
  token: z
    .string({ error: 'The link has no token.' })
    .min(1, 'The link has no token.')
    .max(300, 'The token is too long.'),
  resubscribe: z.enum(['1']).optional(),
});

function scopeOf(token: string) {
  const scope = readUnsubscribeToken(token);
  if (!scope)
    throw new AppError(
      'bad_request',
      'unsubscribe link',
      'This unsubscribe link is not valid. Change your e-mail choices on the settings page instead.',
      [{ path: 'token', message: 'Not a valid unsubscribe token.' }],
    );
  return scope;
}

// GET /api/unsubscribe?token=… – the link in every notification e-mail: stops that kind of e-mail, no sign-in needed
export const GET = route({ access: 'public', query: querySchema }, async ({ query }) => {
  const { userId, scope } = scopeOf(query.token);
  await setEmailScope(userId, scope, false);
  const done = new URL('/notifications/unsubscribed', env().NEXTAUTH_URL);
  done.searchParams.set('token', query.token);
  return Response.redirect(done, 303);
});

// POST /api/unsubscribe?token=… – one-click unsubscribe from a mail client (RFC 8058), or undo with resubscribe=1
export const POST = route({ access: 'public', query: querySchema }, async ({ query }) => {
  const { userId, scope } = scopeOf(query.token);
  const email = query.resubscribe === '1';
  await setEmailScope(userId, scope, email);
  return Response.json({ ok: true, scope, email });
});
