import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, passwordProblem } from './passwords';

describe('passwordProblem', () => {
  test('limits: at least 8, at most 128 (ASVS 5.0 §6.2 asks for ≥ 8 and at least 64 allowed)', () => {
    expect(PASSWORD_MIN_LENGTH).toBe(8);
    expect(PASSWORD_MAX_LENGTH).toBeGreaterThanOrEqual(64);
    expect(PASSWORD_MAX_LENGTH).toBe(128);
  });

  test('7 characters → too short; 8 → fine', () => {
    expect(passwordProblem('anvil-7')).toBe('Use at least 8 characters.');
    expect(passwordProblem('anvil-78')).toBeNull();
    expect(passwordProblem('')).toBe('Use at least 8 characters.');
  });

  test('128 characters → fine; 129 → too long', () => {
    expect(passwordProblem('k'.repeat(127) + 'z')).toBeNull();
    expect(passwordProblem('k'.repeat(129))).toBe('Use at most 128 characters.');
  });

  test('no composition rules: letters only, spaces, digits only, other scripts are all fine', () => {
    for (const ok of ['justlowercaseletters', 'correct horse battery staple', '9073641582', 'ÜberlangesPasswort', 'пароль-пароль']) {
      expect(passwordProblem(ok)).toBeNull();
    }
  });

  test.each(['password', 'Password123', 'PASSWORD1', 'football', 'Football1', '12345678', 'qwerty123', 'changeme'])(
    'common password %j is refused, whatever its case',
    (password) => {
      expect(passwordProblem(password)).toBe('That password is too common; choose another.');
    },
  );

  test('a common password with something added is not on the list', () => {
    expect(passwordProblem('password-for-the-line-room')).toBeNull();
  });

  // NIST SP 800-63B §5.1.1.2 counts each Unicode code point as one character (from memory until checked).
  test('length counts characters, not UTF-16 units: 4 emoji are 4 characters', () => {
    const fourEmoji = '\u{1F3C8}\u{1F3C8}\u{1F3C8}\u{1F3C8}';
    expect(fourEmoji.length).toBe(8);
    expect(passwordProblem(fourEmoji)).toBe('Use at least 8 characters.');
    expect(passwordProblem('\u{1F3C8}'.repeat(8))).toBeNull();
  });
});
