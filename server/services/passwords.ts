import { randomBytes, scrypt as scryptCb, timingSafeEqual } from 'node:crypto';

// Looked up at call time (not promisified once) so tests can count the hash work per sign-in.
function scrypt(password: string, salt: Buffer, length: number): Promise<Buffer> {
  return new Promise((resolve, reject) => scryptCb(password, salt, length, (err, key) => (err ? reject(err) : resolve(key))));
}
const KEY_LENGTH = 64;

/** Salted scrypt hash as `scrypt$<salt b64>$<hash b64>`. */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const hash = await scrypt(password, salt, KEY_LENGTH);
  return `scrypt$${salt.toString('base64')}$${hash.toString('base64')}`;
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, saltB64, hashB64] = stored.split('$');
  if (scheme !== 'scrypt' || !saltB64 || !hashB64) return false;
  const expected = Buffer.from(hashB64, 'base64');
  const actual = await scrypt(password, Buffer.from(saltB64, 'base64'), expected.length);
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

// A real hash of a random secret, checked when the username is unknown, so an unknown user
// costs the same scrypt work as a wrong password and the two cannot be told apart by timing.
let decoyHash: Promise<string> | undefined;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword(randomBytes(12).toString('hex'));
  return decoyHash;
}
