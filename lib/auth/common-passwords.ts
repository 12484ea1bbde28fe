// Passwords too common to accept, of the length Layerwise allows (10+ characters). Entries are FROM MEMORY of the
// top of the public breached-password lists (the UK NCSC's "100k-most-used-passwords-NCSC" list and SecLists'
// "10-million-password-list-top" files), which are dominated by number runs, keyboard rows and "password"/"qwerty"
// with digits; the pattern checks in password-rules.ts catch the families these examples stand for. A maintained
// library with a shipped dictionary (e.g. @zxcvbn-ts/core with @zxcvbn-ts/language-common) would replace this list.
// Lower case; compared after lower-casing the candidate.
export const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  "1234567890", "0987654321", "12345678910", "123456789a", "1234567890a", "a123456789", "123456789q",
  "qwertyuiop", "qwertyuiop123", "qwerty1234", "qwerty12345", "qwerty123456", "1qaz2wsx3edc", "1q2w3e4r5t",
  "1q2w3e4r5t6y", "q1w2e3r4t5", "q1w2e3r4t5y6", "zaq12wsxcde3", "asdfghjkl1", "asdfghjkl;", "zxcvbnm123",
  "password12", "password123", "password1234", "password12345", "password01", "password!", "password1!",
  "passw0rd123", "p@ssword123", "p@ssw0rd123", "passwordpassword", "mypassword", "mypassword1", "newpassword",
  "changeme123", "letmein123", "welcome123", "welcome1234", "iloveyou12", "iloveyou123", "sunshine123",
  "princess123", "football123", "baseball123", "superman123", "trustno1234", "abc1234567", "abcdefghij",
  "abcdefghijk", "abcd123456", "1234abcd12", "administrator", "admin12345", "admin123456", "monkey1234",
  "dragon1234", "master1234", "computer123", "internet123", "chemistry1", "chemistry123", "laboratory",
  "laboratory1", "layerwise1", "layerwise123",
]);
