import bcrypt from "bcryptjs";

const COST = 12;
const COMMON = new Set([
  "password", "password1", "password123", "123456789012", "qwertyuiop12", "letmein12345",
  "synledger123", "welcome12345", "administrator", "changeme1234", "iloveyou1234",
]);

export async function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

let dummyHash: string | null = null;

/**
 * Checks a password. With no stored hash (unknown user) it still spends the time of a real
 * comparison, so response times do not tell which e-mail addresses exist.
 */
export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    dummyHash ??= await bcrypt.hash("no such user", COST);
    await bcrypt.compare(plain, dummyHash);
    return false;
  }
  return bcrypt.compare(plain, hash);
}

/**
 * Minimum strength: at least 12 characters, three of four character classes, not a common
 * password and not the e-mail's local part. Returns the reasons it fails (empty when fine).
 */
export function passwordProblems(plain: string, email?: string): string[] {
  const problems: string[] = [];
  if (plain.length < 12) problems.push("use at least 12 characters");
  if (plain.length > 128) problems.push("use at most 128 characters");
  const classes = [/[a-z]/, /[A-Z]/, /[0-9]/, /[^A-Za-z0-9]/].filter((re) => re.test(plain)).length;
  if (classes < 3) problems.push("mix at least three of: lower case, upper case, digits, symbols");
  if (COMMON.has(plain.toLowerCase())) problems.push("this password is too common");
  const local = email?.split("@")[0]?.toLowerCase();
  if (local && local.length >= 4 && plain.toLowerCase().includes(local)) {
    problems.push("do not build the password from your e-mail address");
  }
  return problems;
}
