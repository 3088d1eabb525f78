/**
 * Password policy (OWASP ASVS 5.0 §6.2): at least 8 characters, at most 128, no composition rules,
 * and not one of the most common passwords.
 */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_LENGTH = 128;

// A short list of the passwords that top every breach list; the check is case-insensitive.
// Common practice, no source beyond those lists being widely published.
const COMMON_PASSWORDS = new Set([
  'password', 'password1', 'password123', '12345678', '123456789', '1234567890', 'qwertyuiop',
  'qwerty123', '11111111', '00000000', 'iloveyou', 'sunshine1', 'football', 'football1',
  'baseball', 'welcome1', 'letmein1', 'abc12345', 'trustno1', 'passw0rd', 'superman',
  'princess', 'qwertyui', '87654321', '12341234', 'changeme', 'admin123', 'starwars',
]);

/** Returns a message describing why the password is not acceptable, or null when it is fine. */
export function passwordProblem(password: string): string | null {
  // Count characters (code points), not UTF-16 units: an emoji is one character.
  const length = [...password].length;
  if (length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
  if (COMMON_PASSWORDS.has(password.toLowerCase())) return 'That password is too common; choose another.';
  return null;
}
