/**
 * Passwords of ten characters or more that appear near the top of published leaked-password
 * frequency lists, written down from memory of those lists (not exhaustive), plus obvious ones
 * for this product. Shorter ones are refused by the minimum length already.
 */
export const commonPasswords: ReadonlySet<string> = new Set([
  '1234567890', '0987654321', '12345678910', '1234512345', '123123123123', '1234567891', '1111111111',
  '0000000000', '123456789a', '987654321a', 'a123456789', '1q2w3e4r5t', '1q2w3e4r5t6y', '1qaz2wsx3edc',
  'q1w2e3r4t5', 'q1w2e3r4t5y6', 'qwertyuiop', 'qwertyuiop1', 'qwerty1234', 'qwerty12345', 'qwerty123456',
  'asdfghjkl1', 'asdfghjkl;', 'zxcvbnm123', 'zaq12wsxcde', 'qazwsxedc123', 'qazwsxedcrfv', 'abcdefghij',
  'abc1234567', 'abcd123456', 'aaaaaaaaaa', 'password12', 'password01', 'password123', 'password1234',
  'password12345', 'passw0rd123', 'passwordpassword', 'p@ssword123', 'p@ssw0rd123', 'iloveyou12',
  'iloveyou123', 'loveyou123', 'welcome123', 'welcome1234', 'letmein123', 'letmein1234', 'changeme123',
  'administrator', 'adminadmin', 'admin12345', 'admin123456', 'sunshine123', 'football123', 'baseball123',
  'princess123', 'superman123', 'starwars123', 'monkey1234', 'dragon1234', 'master1234', 'shadow1234',
  'trustno1234', 'michael123', 'computer123', 'internet123', 'whatever123', 'basketball', 'basketball1',
  'football12', 'liverpool1', 'chocolate1', 'strongpassword', 'mypassword', 'mypassword1', 'secret1234',
  'qwerty@123', 'test123456', 'testtest123', 'guest12345', 'default123', 'riffle1234', 'riffle12345',
  'rifflepassword', 'pondpump123', 'waterfall123', 'waterfall1',
]);
