/**
 * Common passwords refused at sign-up and reset (10 characters or more, since shorter ones fail the
 * length rule anyway). A short list of well-known examples (common practice); the hardening work
 * replaces it with a longer list shipped with the app.
 */
export const COMMON_PASSWORDS = new Set(
  [
    '1234567890', '0123456789', '12345678910', 'qwertyuiop', 'password123', 'password12', 'password1!',
    'iloveyou12', 'abcdefghij', '1q2w3e4r5t', 'qwerty1234', 'q1w2e3r4t5', 'passw0rd123', 'administrator',
    'letmein123', 'welcome123', 'changeme123', '1111111111', '0000000000', 'aaaaaaaaaa', 'qwertyuiop1',
    'football123', 'baseball123', 'sunshine123', 'princess123', 'dragon1234', 'monkey1234', 'superman123',
    'trustno1234', 'password1234', 'passwordpassword', 'asdfghjkl1', 'zxcvbnm123', 'mosquito123',
  ],
);
