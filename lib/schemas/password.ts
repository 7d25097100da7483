// What a password chosen by a person must be. Universal: the forms check it before sending and
// the routes check it again. NIST SP 800-63B §5.1.1.2 (memorized secrets): at least 8 characters
// (we ask for 12, a passphrase typed once a shift), at most 64 or more accepted, no composition
// rules, and a check against values known to be commonly used, expected or compromised.
import { z } from 'zod';

export const passwordMinLength = 12;
export const passwordMaxLength = 200;

// The most common passwords in public breach corpora, and words of this product; a password
// made of one of these plus digits or symbols is refused too (common practice, no published source
// for the exact list).
const commonWords = [
  'password',
  'passw0rd',
  'p@ssword',
  'qwerty',
  'qwertyuiop',
  'asdfgh',
  'zxcvbn',
  'letmein',
  'welcome',
  'iloveyou',
  'admin',
  'administrator',
  'monkey',
  'dragon',
  'football',
  'baseball',
  'sunshine',
  'princess',
  'master',
  'shadow',
  'trustno1',
  'abc123',
  'changeme',
  'secret',
  'rigcall',
  'trucking',
  'truckdriver',
  'driver',
  'mechanic',
  'supervisor',
  'inspection',
];

const sequences = ['0123456789', 'abcdefghijklmnopqrstuvwxyz', 'qwertyuiopasdfghjklzxcvbnm'];

/** Why this password may not be used, or null when it may. */
export function findPasswordProblem(password: string, about: { email?: string; name?: string } = {}): string | null {
  if (password.length < passwordMinLength)
    return `Use at least ${passwordMinLength} characters; a few words with spaces work well.`;
  if (password.length > passwordMaxLength) return `Keep it under ${passwordMaxLength} characters.`;
  const lower = password.toLowerCase();
  const core = lower.replace(/[^a-z]/g, '');
  if (new Set(lower).size < 4) return 'Use more different characters than that.';
  if (sequences.some((s) => s.includes(lower) || `${s}${s}`.includes(lower)))
    return 'A run of keys or digits is among the first passwords tried. Pick something else.';
  if (/^\d+$/.test(lower)) return 'Digits alone are guessed quickly. Use words.';
  if (commonWords.some((w) => core === w || core === `${w}${w}`) || commonWords.includes(lower))
    return 'That is one of the most common passwords. Pick something else.';
  const local = about.email?.split('@')[0]?.toLowerCase();
  if (about.email && lower.includes(about.email.toLowerCase())) return 'Do not use your e-mail address.';
  if (local && local.length >= 4 && lower.replace(/[^a-z0-9]/g, '') === local.replace(/[^a-z0-9]/g, ''))
    return 'Do not use your e-mail address.';
  const name = about.name?.toLowerCase().replace(/[^a-z]/g, '');
  if (name && name.length >= 4 && core === name) return 'Do not use your name.';
  return null;
}

const newPasswordSchema = z.string('Enter a new password.').max(passwordMaxLength + 1);

export const changePasswordBodySchema = z.object({
  currentPassword: z
    .string('Enter your current password.')
    .min(1, 'Enter your current password.')
    .max(passwordMaxLength),
  newPassword: newPasswordSchema,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBodySchema>;

export const forgotPasswordBodySchema = z.object({
  email: z
    .string('Enter your e-mail address.')
    .trim()
    .toLowerCase()
    .max(254, 'An e-mail address is at most 254 characters.')
    .pipe(z.email('Enter an e-mail address like name@company.com.')),
});

export const resetPasswordBodySchema = z.object({
  token: z.string('The link is missing its code.').regex(/^[A-Za-z0-9_-]{20,100}$/, 'The link is not complete.'),
  newPassword: newPasswordSchema,
});
