// Request schemas and response types for sign-in, sign-up and password reset.
import { z } from 'zod';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'An e-mail address is at most 254 characters.')
  .pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' }));

export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(10, 'Use at least 10 characters for the password.')
  .max(200, 'A password is at most 200 characters.')
  .refine((password) => password.trim().length > 0, 'A password of spaces only is too easy to guess: use letters, digits or words too.');

export const signUpRequest = z.object({
  email: emailSchema,
  displayName: z
    .string({ error: 'Enter your name.' })
    .trim()
    .min(1, 'Enter your name.')
    .max(80, 'A name is at most 80 characters.'),
  password: newPasswordSchema,
  /** Optional invite token: accepting an invite while creating the account. */
  inviteToken: z.string().max(200).optional(),
});
export type SignUpRequest = z.infer<typeof signUpRequest>;

export const signInRequest = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
});
export type SignInRequest = z.infer<typeof signInRequest>;

export const resetRequest = z.object({ email: emailSchema });
export type ResetRequest = z.infer<typeof resetRequest>;

export const resetConfirmRequest = z.object({
  token: z.string({ error: 'The reset link is incomplete.' }).min(20, 'The reset link is incomplete.').max(200),
  password: newPasswordSchema,
});
export type ResetConfirmRequest = z.infer<typeof resetConfirmRequest>;

export const signUpConfirmRequest = z.object({
  token: z.string({ error: 'The sign-up link is incomplete.' }).min(20, 'The sign-up link is incomplete.').max(200),
});
export type SignUpConfirmRequest = z.infer<typeof signUpConfirmRequest>;

/**
 * POST /api/auth/sign-up without an invite answers 202 with this, word for word the same whether or not the address
 * has an account; the mail says which (a link to finish, or a note that the account exists).
 */
export interface SignUpMailedResponse {
  status: 'check-mail';
  message: string;
}

export interface UserDto {
  id: string;
  email: string;
  displayName: string;
}

/** GET /api/auth/me answers the signed-in user, or `{user: null}`. */
export interface MeResponse {
  user: UserDto | null;
}
