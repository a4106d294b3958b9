/**
 * Passwords refused when a user chooses one (invitation or reset), whatever their letter case.
 *
 * The list ships with the app (no network at start). It is built from the base passwords and words
 * that lead every published count of leaked passwords, and from the ways people stretch them to meet
 * a length rule — digits and years appended, a trailing "!", the word doubled — plus keyboard walks and
 * digit runs. Only entries of 10 characters or more are kept, since shorter ones fail the length rule
 * anyway (OWASP ASVS 5.0 V6.2.4 asks for at least the top 3,000 that match the policy; the size is
 * tested in tests/api/security.test.ts and stated in docs/security.md).
 *
 * CONTEXT_WORDS are the words of this service (ASVS V6.1.2, V6.2.11): a password whose letters are
 * only one of them, like "Broodcast2026!" or "mosquito-123456", is refused too.
 */

const BASES = [
  // The long-standing heads of the leaked-password counts.
  'password', 'passw0rd', 'p@ssword', 'p@ssw0rd', 'pa55word', 'qwerty', 'qwertyui', 'qwertyuiop', 'asdfgh', 'asdfghjk',
  'asdfghjkl', 'zxcvbn', 'zxcvbnm', 'azerty', 'qwertz', 'abc123', 'abcdef', 'abcdefg', 'abcd1234', 'iloveyou', 'ilovegod',
  'loveme', 'lovely', 'letmein', 'welcome', 'changeme', 'trustno1', 'monkey', 'dragon', 'master', 'shadow', 'sunshine',
  'princess', 'football', 'baseball', 'basketball', 'soccer', 'hockey', 'superman', 'batman', 'spiderman', 'starwars',
  'pokemon', 'michael', 'jennifer', 'jordan', 'hunter', 'buster', 'harley', 'ranger', 'thomas', 'robert', 'daniel',
  'andrew', 'joshua', 'matthew', 'jessica', 'michelle', 'ashley', 'nicole', 'amanda', 'charlie', 'george', 'maggie',
  'ginger', 'pepper', 'tigger', 'cheese', 'summer', 'winter', 'autumn', 'spring', 'freedom', 'computer', 'internet',
  'killer', 'mustang', 'ferrari', 'corvette', 'yankees', 'dallas', 'austin', 'thunder', 'taylor', 'matrix', 'access',
  'secret', 'whatever', 'flower', 'hello', 'helloworld', 'admin', 'administrator', 'root', 'login', 'guest', 'default',
  'test', 'tester', 'testing', 'user', 'manager', 'service', 'support', 'office', 'company', 'business', 'money',
  'silver', 'golden', 'diamond', 'orange', 'banana', 'apple', 'chocolate', 'cookie', 'cupcake', 'butterfly', 'angel',
  'angels', 'family', 'friends', 'forever', 'lovers', 'blessed', 'jesus', 'christ', 'heaven', 'purple', 'yellow',
  'samsung', 'google', 'facebook', 'microsoft', 'windows', 'linux', 'oracle', 'cisco', 'london', 'paris', 'berlin',
  'newyork', 'liverpool', 'arsenal', 'chelsea', 'barcelona', 'madrid', 'juventus', 'qazwsx', 'qazwsxedc', 'zaq12wsx',
  '1qaz2wsx', '1q2w3e', '1q2w3e4r', 'q1w2e3r4', 'asdf1234', 'qwer1234', 'zxcv1234', 'aa123456', 'a1b2c3', 'a1b2c3d4',
  'passpass', 'mypassword', 'newpassword', 'mypass', 'letmein1', 'iloveu', 'babygirl', 'sweetheart', 'lovelove',
  'soccer1', 'princesa', 'contrasena', 'motdepasse', 'passwort', 'senha', 'parola', 'salasana', 'wachtwoord',
  'doctor', 'nurse', 'clinic', 'hospital', 'medical', 'health', 'healthy', 'fitness', 'mother', 'father', 'sister',
  'brother', 'daughter', 'number', 'secret1', 'private', 'security', 'nothing', 'anything', 'everything', 'someone',
];

const SUFFIXES = [
  '', '1', '2', '7', '12', '13', '21', '22', '23', '69', '77', '88', '99', '00', '01', '007', '100', '111', '123', '222',
  '321', '666', '777', '999', '1234', '4321', '2580', '12345', '54321', '123456', '654321', '1234567', '12345678',
  '123456789', '!', '!!', '1!', '12!', '123!', '1234!', '12345!', '@123', '#1', '_123', '.123', '-123', '123123',
  '112233', '111111', '000000',
  ...Array.from({ length: 2026 - 1960 + 1 }, (_, i) => String(1960 + i)),
  ...Array.from({ length: 2026 - 1990 + 1 }, (_, i) => `${1990 + i}!`),
];

/** Keyboard walks, digit runs and repeats that are common on their own. */
const RUNS = [
  '1234567890', '0123456789', '12345678910', '0987654321', '9876543210', '1234512345', '1234567891', '1122334455',
  '1111122222', '1212121212', '1231231231', '1234123412', '1029384756', '5555555555', '2222222222', '0000000000',
  '1111111111', '1234554321', '123456789a', 'a123456789', 'qwertyuiop1', 'qwertyuiop123', '1qaz2wsx3edc', 'zaq1xsw2cde3',
  'qazwsxedcrfv', '1q2w3e4r5t', '1q2w3e4r5t6y', 'q1w2e3r4t5', 'q1w2e3r4t5y6', 'qwerty123456', 'asdfghjkl1', 'asdfghjkl123',
  'zxcvbnm123', 'zxcvbnm1234', 'abcdefghij', 'abcdefghijk', 'abcdefghijkl', 'abcdefg123', 'abcde12345', 'abc1234567',
  'aaaaaaaaaa', 'zzzzzzzzzz', 'qqqqqqqqqq', 'xxxxxxxxxx', 'qweasdzxc1', 'qweasdzxc123', '1qazxsw23edc', 'poiuytrewq',
  'mnbvcxzasd', 'lkjhgfdsa1', 'passwordpassword', 'password1234567', 'iloveyou1234',
];

/** Words of this service and its field (the context-specific list of ASVS V6.1.2). */
export const CONTEXT_WORDS = [
  'broodcast', 'halvern', 'mosquito', 'mosquitoes', 'mosquitos', 'larva', 'larvae', 'larval', 'ladder', 'bulletin',
  'advisory', 'vector', 'vectors', 'district', 'districts', 'epidemic', 'outbreak', 'surveillance', 'dengue', 'malaria',
  'westnile', 'aedes', 'anopheles', 'culex', 'breteau', 'degreeday', 'supervisor', 'officer', 'epidemiologist',
  'healthofficer', 'communityworker', 'saltmere',
];

function build(): Set<string> {
  const out = new Set<string>();
  const add = (p: string) => {
    if (p.length >= 10) out.add(p.toLowerCase());
  };
  for (const base of [...BASES, ...CONTEXT_WORDS]) {
    for (const suffix of SUFFIXES) {
      add(base + suffix);
      if (suffix && /^\d+$/.test(suffix)) add(suffix + base);
    }
    add(base + base);
    add(`${base}${base}1`);
    add(`my${base}123`);
    add(`i love ${base}`.replace(/ /g, ''));
  }
  for (const run of RUNS) add(run);
  return out;
}

export const COMMON_PASSWORDS: ReadonlySet<string> = build();

/** True when the password's letters are nothing but one word of the service (digits and symbols aside). */
export function isContextWordPassword(password: string): boolean {
  const letters = password.toLowerCase().replace(/[^a-z]/g, '');
  return CONTEXT_WORDS.some((w) => letters === w || letters === w + w);
}
