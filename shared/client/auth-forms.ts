// The auth screens' form schemas. better-auth checks the same things on the server; these give the message first.
import { z } from 'zod';

const email = z.string().trim().min(1, 'Enter your e-mail').email('Enter a valid e-mail address');
// better-auth's default minimum length is 8 characters.
const newPassword = z
  .string()
  .min(8, 'Use at least 8 characters')
  .max(128, 'Use at most 128 characters');

export const signInForm = z.object({
  email,
  password: z.string().min(1, 'Enter your password'),
});

export const signUpForm = z.object({
  name: z.string().trim().min(1, 'Enter your name').max(120, 'Use at most 120 characters'),
  email,
  password: newPassword,
});

export const forgotPasswordForm = z.object({ email });

export const resetPasswordForm = z
  .object({ password: newPassword, confirm: z.string().min(1, 'Type the password again') })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' });

export type SignInForm = z.infer<typeof signInForm>;
export type SignUpForm = z.infer<typeof signUpForm>;
export type ForgotPasswordForm = z.infer<typeof forgotPasswordForm>;
export type ResetPasswordForm = z.infer<typeof resetPasswordForm>;
