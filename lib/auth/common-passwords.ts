// A short list of the passwords seen most often in public breach corpora (common practice to refuse them).
// Only entries of 12 characters or more matter, since shorter ones already fail the length rule;
// the list is compared case-insensitively.
const COMMON = new Set(
  [
    '123456789012', '1234567890123', '12345678901234', '123456123456', '111111111111', '000000000000',
    'qwertyuiopas', 'qwertyuiop123', 'qwerty123456', '1q2w3e4r5t6y', '1qaz2wsx3edc', 'zaq12wsxcde3',
    'passwordpassword', 'password1234', 'password12345', 'password123456', 'passw0rd1234', 'p@ssw0rd1234',
    'iloveyou1234', 'letmein12345', 'welcome12345', 'welcome123456', 'administrator', 'admin1234567',
    'abcdefghijkl', 'abcdefg12345', 'abc123456789', 'football1234', 'baseball1234', 'superman1234',
    'princess1234', 'sunshine1234', 'trustno11234', 'monkey123456', 'dragon123456', 'master123456',
    'changeme1234', 'qwertyqwerty', 'asdfghjkl123', 'asdfasdfasdf', 'zxcvbnm12345', 'homebrew1234',
    'beerbeerbeer', 'ilovebeer123', 'aaaaaaaaaaaa', 'iloveyouiloveyou', 'mypassword123', 'secret123456',
  ].map((p) => p.toLowerCase()),
);

export function isCommonPassword(password: string): boolean {
  const lower = password.toLowerCase();
  return COMMON.has(lower) || /^(.)\1+$/.test(lower) || /^(0123456789|1234567890)+\d*$/.test(lower);
}
