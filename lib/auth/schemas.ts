import { z } from 'zod';
import { isCommonPassword } from './common-passwords';

export const PASSWORD_MIN_LENGTH = 12;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }))
  .transform((e) => e.toLowerCase());

const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters; a few unrelated words work well.`)
  .max(200, 'Use at most 200 characters.')
  .refine((p) => !isCommonPassword(p), 'That password is one of the most common ones; please choose another.');

const displayNameSchema = z
  .string({ error: 'Enter the name other brewers will see.' })
  .trim()
  .min(2, 'Use at least 2 characters for your name.')
  .max(60, 'Use at most 60 characters for your name.');

export const signUpSchema = z.object({
  name: displayNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
});
export type SignUpInput = z.input<typeof signUpSchema>;

export const roleChangeSchema = z.object({
  role: z.enum(['member', 'moderator', 'admin'], { error: 'Role must be member, moderator or admin.' }),
});

export const suspendSchema = z.object({
  suspended: z.boolean({ error: 'Say whether the member is suspended (true or false).' }),
  reason: z.string().trim().max(500, 'Keep the reason under 500 characters.').optional(),
});
