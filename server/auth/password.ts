/**
 * Password hashing with Node's scrypt (RFC 7914), run asynchronously in libuv's thread pool so that a sign-in never
 * holds up the event loop. Stored as `scrypt$<log2 N>$<r>$<p>$<salt, base64>$<key, base64>`. Hashes made by
 * earlier versions with bcrypt are still accepted (bcryptjs's asynchronous compare) and replaced by an scrypt hash
 * at the next successful sign-in. See docs/decisions/0015-password-hashing.md.
 */
import bcrypt from 'bcryptjs';
import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/** log2 of scrypt's cost N: 2^15 with r = 8 takes 32 MiB and about 0.1 s per hash on the development machine. */
export const passwordHashCost = 15;
const blockSize = 8;
const parallelism = 1;
const keyLength = 64;
const saltLength = 16;

/**
 * Hashes running at once. scrypt runs in libuv's thread pool (4 threads unless UV_THREADPOOL_SIZE says otherwise),
 * which also serves the session token's Web Crypto work and file access: a flood of sign-ins may take at most half
 * of it, the rest waits here in the event loop's queue (which costs nothing) so signed-in requests stay fast.
 */
const maxParallelHashes = Math.max(1, Math.floor(Number(process.env.UV_THREADPOOL_SIZE || 4) / 2));
let running = 0;
const waiting: (() => void)[] = [];

async function withHashSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= maxParallelHashes) await new Promise<void>((resolvePromise) => waiting.push(resolvePromise));
  running += 1;
  try {
    return await work();
  } finally {
    running -= 1;
    waiting.shift()?.();
  }
}

function scryptAsync(password: string, salt: Buffer, cost: number, r: number, p: number): Promise<Buffer> {
  // Memory scrypt needs is 128 · N · r bytes; allow twice that.
  const options: ScryptOptions = { N: 2 ** cost, r, p, maxmem: 256 * 2 ** cost * r + 1024 * 1024 };
  return withHashSlot(
    () =>
      new Promise((resolvePromise, reject) => {
        scrypt(password.normalize('NFC'), salt, keyLength, options, (error, key) => (error ? reject(error) : resolvePromise(key)));
      }),
  );
}

interface ScryptHash {
  cost: number;
  r: number;
  p: number;
  salt: Buffer;
  key: Buffer;
}

function parseScryptHash(hash: string): ScryptHash | null {
  const match = /^scrypt\$(\d{1,2})\$(\d{1,2})\$(\d{1,2})\$([A-Za-z0-9+/=]+)\$([A-Za-z0-9+/=]+)$/.exec(hash);
  if (!match) return null;
  const [cost, r, p] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (cost < 1 || cost > 20 || r < 1 || p < 1) return null;
  return { cost, r, p, salt: Buffer.from(match[4], 'base64'), key: Buffer.from(match[5], 'base64') };
}

/** A new scrypt hash of the password; `cost` is log2 of N (tests use a small one). */
export async function hashPassword(password: string, cost = passwordHashCost): Promise<string> {
  const salt = randomBytes(saltLength);
  const key = await scryptAsync(password, salt, cost, blockSize, parallelism);
  return `scrypt$${cost}$${blockSize}$${parallelism}$${salt.toString('base64')}$${key.toString('base64')}`;
}

/**
 * Compared against when the e-mail is unknown, so that a wrong e-mail costs as long as a wrong password: a salt and
 * key of random bytes at passwordHashCost (no password leads to it, and no process spends a hash making it).
 */
export const decoyHash = `scrypt$${passwordHashCost}$${blockSize}$${parallelism}$${randomBytes(saltLength).toString('base64')}$${randomBytes(keyLength).toString('base64')}`;

function isBcryptHash(hash: string): boolean {
  return /^\$2[abxy]?\$\d{2}\$/.test(hash);
}

/** True when the password matches the stored hash (scrypt, or bcrypt from earlier versions); false without a hash. */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  const stored = hash ?? decoyHash;
  if (isBcryptHash(stored)) return (await bcrypt.compare(password, stored)) && Boolean(hash);
  const parsed = parseScryptHash(stored);
  if (!parsed) {
    // An unreadable stored hash matches nothing, after the same work as a real one.
    await verifyPassword(password, decoyHash);
    return false;
  }
  const key = await scryptAsync(password, parsed.salt, parsed.cost, parsed.r, parsed.p);
  return key.length === parsed.key.length && timingSafeEqual(key, parsed.key) && Boolean(hash);
}

/** True when a stored hash should be replaced at the next successful sign-in: a bcrypt hash of an earlier version. */
export function passwordNeedsRehash(hash: string): boolean {
  return isBcryptHash(hash);
}
