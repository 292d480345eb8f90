import crypto from "node:crypto";
import os from "node:os";
import path from "node:path";
import { Piscina } from "piscina";
import { HttpError } from "../http/errors";

/**
 * Password hashing, off the main thread.
 *
 * New hashes: scrypt through Node's asynchronous `crypto.scrypt`, which runs on libuv's thread pool (Node docs,
 * crypto.scrypt: "asynchronous scrypt implementation"), with the parameters of the OWASP Password Storage Cheat
 * Sheet ("scrypt with a minimum CPU/memory cost parameter of (2^17), a minimum block size of 8 (1024 bytes), and a
 * parallelization parameter of 1"). Stored as a PHC-style string `$scrypt$ln=17,r=8,p=1$<salt>$<hash>` (base64
 * without padding, as the PHC string format does), so the parameters travel with each hash and can be raised later.
 *
 * Old hashes: bcrypt (`$2a$`/`$2b$`/`$2y$`) still verify, in a worker thread (bcryptjs is pure JavaScript), and a
 * successful sign-in replaces them with scrypt (see needsRehash). bcrypt only ever looked at the first 72 bytes;
 * those hashes only verify, so nothing new is ever truncated (OWASP ASVS 4.0.3 V2.1.3: no truncation).
 *
 * Only a few hashes run at once (each scrypt takes 128 MiB and a core for ~0.5 s at N=2^17); a bounded number more
 * wait their turn; beyond that the request is answered 503 with Retry-After at once (see hashingCapacity).
 */

/** OWASP Password Storage Cheat Sheet, scrypt: N=2^17, r=8, p=1. */
export const PRODUCTION_SCRYPT = { logN: 17, r: 8, p: 1 } as const;
/** 16 bytes of salt and a 32-byte key: common practice, no source (the cheat sheet asks for a unique random salt). */
const SALT_BYTES = 16;
const KEY_BYTES = 32;

export interface ScryptParams {
  logN: number;
  r: number;
  p: number;
}

/**
 * The cost new hashes get. Production: the OWASP figures. `SCRYPT_LOG_N` lowers N for tests (as BCRYPT_ROUNDS=4 did
 * for bcrypt); under NODE_ENV=test without it, N=2^10 keeps the suites fast. Read on every call so a test can switch
 * to the production cost for the event-loop test.
 */
export function currentScryptParams(): ScryptParams {
  const raw = process.env.SCRYPT_LOG_N;
  const logN = raw ? Number(raw) : process.env.NODE_ENV === "test" ? 10 : PRODUCTION_SCRYPT.logN;
  if (!Number.isInteger(logN) || logN < 10 || logN > 20) throw new Error(`SCRYPT_LOG_N must be a whole number from 10 to 20, got "${raw}"`);
  return { logN, r: PRODUCTION_SCRYPT.r, p: PRODUCTION_SCRYPT.p };
}

/**
 * Node's scrypt refuses to run when 128 * N * r exceeds maxmem (default 32 MiB; Node docs, crypto.scrypt options):
 * N=2^17, r=8 needs 128 MiB. Allow twice the need, the check is approximate.
 */
const maxmemFor = ({ logN, r, p }: ScryptParams) => 2 * 128 * 2 ** logN * r * p;

// ---- the cap on concurrent hashing ----

/**
 * How many hashes run at once: leave a core for the event loop — one at a time on this 2-core machine, up to 4 on
 * bigger ones — unless HASH_CONCURRENCY says otherwise (common practice, no source). And how many may wait: 8 per
 * slot, about 4–6 s at production cost; a longer wait is better answered at once with "try again in a few seconds"
 * (common practice, no source). Read when the first hash is asked for.
 */
function hashingCapacity(): { concurrency: number; queue: number } {
  const cores = os.availableParallelism?.() ?? os.cpus().length;
  const concurrency = Math.max(1, Math.min(16, Number(process.env.HASH_CONCURRENCY) || Math.min(4, cores - 1)));
  return { concurrency, queue: 8 * concurrency };
}

export class BoundedSemaphore {
  private active = 0;
  private readonly waiting: Array<() => void> = [];
  /** The most slots ever in use at once (read by the tests). */
  peakActive = 0;

  constructor(
    readonly max: number,
    readonly maxQueue: number,
  ) {}

  get queued() {
    return this.waiting.length;
  }
  get inUse() {
    return this.active;
  }

  async run<T>(fn: () => Promise<T>): Promise<T> {
    if (this.active < this.max) {
      this.active++;
    } else {
      if (this.waiting.length >= this.maxQueue) throw busy();
      // The releasing call hands its slot straight to us (active stays the same).
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    }
    this.peakActive = Math.max(this.peakActive, this.active);
    try {
      return await fn();
    } finally {
      const next = this.waiting.shift();
      if (next) next();
      else this.active--;
    }
  }
}

const busy = () =>
  new HttpError(503, "busy", "Sign-in is very busy right now. Wait a few seconds and try again.", undefined, { retryAfterSeconds: 5 }, { "Retry-After": "5" });

let slots: BoundedSemaphore | null = null;
/** The process's hashing slots (made on first use, from HASH_CONCURRENCY or the core count). */
export function hashingSlots(): BoundedSemaphore {
  if (!slots) {
    const { concurrency, queue } = hashingCapacity();
    slots = new BoundedSemaphore(concurrency, queue);
  }
  return slots;
}

/**
 * Admission for whole requests that end in a hash (sign-in): at most as many at once as can hold or wait for a hashing
 * slot. Later ones are turned away before any database work, so a burst costs the server and its connection pool
 * next to nothing beyond what the hashing cap lets through.
 */
let admitted = 0;
/** Take an admission, or throw the 503; call the returned function (once) when done. */
export function admitHashing(): () => void {
  if (admitted >= hashingSlots().max + hashingSlots().maxQueue) throw busy();
  admitted++;
  let released = false;
  return () => {
    if (!released) admitted--;
    released = true;
  };
}

// ---- scrypt ----

const b64 = (buf: Buffer) => buf.toString("base64").replace(/=+$/, "");

function scrypt(password: string, salt: Buffer, params: ScryptParams, keyLength: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    crypto.scrypt(password, salt, keyLength, { N: 2 ** params.logN, r: params.r, p: params.p, maxmem: maxmemFor(params) }, (err, key) => (err ? reject(err) : resolve(key)));
  });
}

/**
 * NIST SP 800-63B §5.1.1.2: verifiers SHOULD apply Unicode normalisation (NFKC or NFKD) before hashing, so the same
 * password typed on two keyboards matches. Only for scrypt hashes: bcrypt-era hashes were made from the raw string.
 */
const normalise = (password: string) => password.normalize("NFKC");

async function scryptHash(password: string, params: ScryptParams): Promise<string> {
  const salt = crypto.randomBytes(SALT_BYTES);
  const key = await scrypt(normalise(password), salt, params, KEY_BYTES);
  return `$scrypt$ln=${params.logN},r=${params.r},p=${params.p}$${b64(salt)}$${b64(key)}`;
}

const SCRYPT_RE = /^\$scrypt\$ln=(\d{1,2}),r=(\d{1,2}),p=(\d{1,2})\$([A-Za-z0-9+/]{16,})\$([A-Za-z0-9+/]{16,})$/;

function parseScrypt(hash: string): { params: ScryptParams; salt: Buffer; key: Buffer } | null {
  const m = SCRYPT_RE.exec(hash);
  if (!m) return null;
  const params = { logN: Number(m[1]), r: Number(m[2]), p: Number(m[3]) };
  // Refuse absurd stored parameters rather than let one row take the server's memory.
  if (params.logN < 10 || params.logN > 20 || params.r < 1 || params.r > 16 || params.p < 1 || params.p > 4) return null;
  return { params, salt: Buffer.from(m[4], "base64"), key: Buffer.from(m[5], "base64") };
}

async function scryptVerify(password: string, parsed: { params: ScryptParams; salt: Buffer; key: Buffer }): Promise<boolean> {
  const key = await scrypt(normalise(password), parsed.salt, parsed.params, parsed.key.length);
  return crypto.timingSafeEqual(key, parsed.key);
}

// ---- bcrypt-era hashes, verified in a worker thread ----

const BCRYPT_RE = /^\$2[aby]\$\d\d\$[./A-Za-z0-9]{53}$/;
let pool: Piscina | null = null;
function bcryptPool(): Piscina {
  // Idle workers are unref'd and leave after 30 s, so a test process is not kept alive by them.
  pool ??= new Piscina({ filename: path.join(__dirname, "bcrypt-worker.js"), minThreads: 0, maxThreads: hashingSlots().max, idleTimeout: 30_000 });
  return pool;
}

/** Stop the bcrypt worker threads (tests and a clean shutdown). */
export async function closePasswordHashing(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}

// ---- the public API ----

export async function hashPassword(password: string): Promise<string> {
  const params = currentScryptParams();
  return hashingSlots().run(() => scryptHash(password, params));
}

/** A stored hash to compare against when the e-mail is unknown, with today's parameters: the same work as a real one. */
const dummies = new Map<string, Promise<string>>();
function dummyHash(): Promise<string> {
  const params = currentScryptParams();
  const key = `${params.logN},${params.r},${params.p}`;
  if (!dummies.has(key)) {
    const made = hashingSlots().run(() => scryptHash(crypto.randomBytes(18).toString("base64"), params));
    made.catch(() => dummies.delete(key));
    dummies.set(key, made);
  }
  return dummies.get(key)!;
}

/**
 * Check a password against a stored hash, or, with no stored hash (unknown e-mail), do the same scrypt work against a
 * dummy and answer false, so both cases take the same time (OWASP Authentication Cheat Sheet, "Authentication and
 * Error Messages": a quick exit for an unknown user tells by its timing that the user does not exist — from memory).
 */
export async function verifyPassword(password: string, stored: string | null): Promise<boolean> {
  if (stored && BCRYPT_RE.test(stored)) {
    return hashingSlots().run(async () => Boolean(await bcryptPool().run({ password, hash: stored })));
  }
  const parsed = stored ? parseScrypt(stored) : null;
  if (!parsed) {
    const dummy = parseScrypt(await dummyHash())!;
    await hashingSlots().run(() => scryptVerify(password, dummy));
    return false;
  }
  return hashingSlots().run(() => scryptVerify(password, parsed));
}

/** A bcrypt-era hash, or scrypt with other parameters than today's: replace it after a successful sign-in. */
export function needsRehash(stored: string): boolean {
  const parsed = parseScrypt(stored);
  if (!parsed) return true;
  const now = currentScryptParams();
  return parsed.params.logN !== now.logN || parsed.params.r !== now.r || parsed.params.p !== now.p || parsed.key.length !== KEY_BYTES;
}

/** What kind of hash a stored string is (for tests and logs; never the hash itself). */
export function hashScheme(stored: string): "scrypt" | "bcrypt" | "unknown" {
  if (BCRYPT_RE.test(stored)) return "bcrypt";
  return parseScrypt(stored) ? "scrypt" : "unknown";
}
