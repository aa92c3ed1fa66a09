/**
 * SHA-256 (FIPS 180-4), synchronous, over bytes or UTF-8 text. The registry hashes its YAML bytes
 * and its canonical JSON with it on every load; written here so that loading needs neither
 * `node:crypto` (whose start costs more than the hashing) nor the asynchronous Web Crypto API.
 *
 * @module
 */

/** First 32 bits of the fractional parts of the square (H0) or cube (K) roots of primes. */
function rootBits(count: number, root: (x: number) => number): Int32Array {
  const out = new Int32Array(count);
  let n = 0;
  for (let p = 2; n < count; p++) {
    let prime = true;
    for (let d = 2; d * d <= p; d++) {
      if (p % d === 0) {
        prime = false;
        break;
      }
    }
    if (!prime) continue;
    const r = root(p);
    out[n++] = Math.floor((r - Math.floor(r)) * 2 ** 32) | 0;
  }
  return out;
}

// FIPS 180-4 §4.2.2 and §5.3.3 define the constants this way: cube roots of the first 64
// primes, square roots of the first 8 (a double carries the root to about 50 fractional bits,
// enough for the 32 taken; the tests check the digests against published examples).
const K = rootBits(64, Math.cbrt);
const H0 = rootBits(8, Math.sqrt);
const W = new Int32Array(64);
const H = new Int32Array(8);

function compress(b: Uint8Array, off: number): void {
  for (let t = 0; t < 16; t++) {
    const i = off + 4 * t;
    W[t] = (b[i] << 24) | (b[i + 1] << 16) | (b[i + 2] << 8) | b[i + 3];
  }
  for (let t = 16; t < 64; t++) {
    const x = W[t - 15];
    const y = W[t - 2];
    const s0 = ((x >>> 7) | (x << 25)) ^ ((x >>> 18) | (x << 14)) ^ (x >>> 3);
    const s1 = ((y >>> 17) | (y << 15)) ^ ((y >>> 19) | (y << 13)) ^ (y >>> 10);
    W[t] = (W[t - 16] + s0 + W[t - 7] + s1) | 0;
  }
  let a = H[0], bb = H[1], c = H[2], d = H[3], e = H[4], f = H[5], g = H[6], h = H[7];
  for (let t = 0; t < 64; t++) {
    const S1 = ((e >>> 6) | (e << 26)) ^ ((e >>> 11) | (e << 21)) ^ ((e >>> 25) | (e << 7));
    const ch = (e & f) ^ (~e & g);
    const t1 = (h + S1 + ch + K[t] + W[t]) | 0;
    const S0 = ((a >>> 2) | (a << 30)) ^ ((a >>> 13) | (a << 19)) ^ ((a >>> 22) | (a << 10));
    const maj = (a & bb) ^ (a & c) ^ (bb & c);
    const t2 = (S0 + maj) | 0;
    h = g;
    g = f;
    f = e;
    e = (d + t1) | 0;
    d = c;
    c = bb;
    bb = a;
    a = (t1 + t2) | 0;
  }
  H[0] = (H[0] + a) | 0;
  H[1] = (H[1] + bb) | 0;
  H[2] = (H[2] + c) | 0;
  H[3] = (H[3] + d) | 0;
  H[4] = (H[4] + e) | 0;
  H[5] = (H[5] + f) | 0;
  H[6] = (H[6] + g) | 0;
  H[7] = (H[7] + h) | 0;
}

/**
 * SHA-256 digest of bytes, as 64 lower-case hex digits.
 *
 * Method: FIPS 180-4 §6.2 (padding §5.1.1, 64-byte blocks, 64 rounds). Any length up to
 * 2^53 − 1 bits. Source: FIPS 180-4 (Secure Hash Standard, NIST 2015).
 *
 * @param data the message
 * @returns the digest, hex
 *
 * @example
 * ```ts
 * import { sha256Hex } from "./sha256.ts";
 * // FIPS 180-4 example "abc" (NIST's published example values)
 * const d = sha256Hex(new TextEncoder().encode("abc"));
 * if (d !== "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad") throw new Error(d);
 * ```
 */
export function sha256Hex(data: Uint8Array): string {
  H.set(H0);
  const n = data.length;
  const full = n - (n % 64);
  for (let off = 0; off < full; off += 64) compress(data, off);
  // last blocks: the rest, a 1 bit, zeros, the length in bits (big-endian, 64 bits)
  const tail = new Uint8Array(n % 64 < 56 ? 64 : 128);
  tail.set(data.subarray(full));
  tail[n - full] = 0x80;
  const bits = n * 8;
  const hi = Math.floor(bits / 2 ** 32);
  const lo = bits >>> 0;
  const L = tail.length;
  tail[L - 8] = hi >>> 24;
  tail[L - 7] = hi >>> 16;
  tail[L - 6] = hi >>> 8;
  tail[L - 5] = hi;
  tail[L - 4] = lo >>> 24;
  tail[L - 3] = lo >>> 16;
  tail[L - 2] = lo >>> 8;
  tail[L - 1] = lo;
  for (let off = 0; off < L; off += 64) compress(tail, off);
  let s = "";
  for (let i = 0; i < 8; i++) s += (H[i] >>> 0).toString(16).padStart(8, "0");
  return s;
}

/**
 * SHA-256 of the UTF-8 encoding of several strings one after the other (as hashing each in turn
 * with a streaming hash would give).
 *
 * @param parts the strings
 * @returns the digest, hex
 *
 * @example
 * ```ts
 * import { sha256Hex, sha256OfText } from "./sha256.ts";
 * const whole = sha256Hex(new TextEncoder().encode("a\0bé"));
 * if (sha256OfText(["a", "\0", "bé"]) !== whole) throw new Error("parts");
 * ```
 */
export function sha256OfText(parts: readonly string[]): string {
  let max = 0;
  for (const p of parts) max += p.length * 3;
  const buf = new Uint8Array(max);
  const enc = new TextEncoder();
  let n = 0;
  for (const p of parts) n += enc.encodeInto(p, buf.subarray(n)).written;
  return sha256Hex(buf.subarray(0, n));
}
