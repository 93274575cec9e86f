/**
 * A bounded LRU cache of rendered HTML answers, keyed by a SHA-256 hash of the whole posted form (every field,
 * in the order posted, the unit system and the page controls included). The workbench's answers are pure
 * functions of the form, so the same form gives the same fragment; a form typed back to an earlier state, or a
 * re-sent unchanged form, is answered without parsing, evaluating or rendering again.
 *
 * An entry also keeps the full form text it was made from and is served only when that text is equal, so a
 * hash collision can never serve the answer of a different form. The compressed bodies (brotli, gzip) are kept
 * per entry once made, so a hit costs neither rendering nor compression.
 */
import { createHash } from 'node:crypto';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { FastifyReply, FastifyRequest } from 'fastify';
import type { SafeHtml } from '../views/html.ts';
import { sendHtml, sendKeptHtml } from './html-reply.ts';

export interface CachedAnswer {
  status: number;
  body: SafeHtml;
}

/**
 * A kept answer: its bytes (UTF-8) and compressed bodies are Buffers, which live outside the JavaScript heap, so
 * 200 entries add little to garbage-collection work.
 */
interface Entry {
  status: number;
  source: string;
  utf8: Buffer;
  encoded: Map<'br' | 'gzip', Buffer>;
  /** The cache that keeps it and the key it is kept under (its byte count grows when a compressed body is added). */
  cache: ResponseCache;
  key: string;
}

export type Answer = { status: number; body: SafeHtml; entry?: undefined } | { status: number; body?: undefined; entry: Entry };

/** Below this size an answer is sent uncompressed (as @fastify/compress does with its threshold in server/app.ts). */
const COMPRESS_THRESHOLD = 1024;

/**
 * The encoding for a request's Accept-Encoding (q=0 refuses one): gzip at level 1 when accepted, else brotli at
 * quality 1 (`prefer` 'br' puts brotli first: static files, compressed once). Both are the fastest settings (about 0.3 ms for a 50 KB answer against 0.8 ms for brotli quality 4)
 * and the answer is about 11 KB either way; on loopback or a LAN the CPU matters more than 15 % of the bytes.
 */
export function chooseEncoding(accept: string | string[] | undefined, prefer: 'br' | 'gzip' = 'gzip'): 'br' | 'gzip' | null {
  const text = Array.isArray(accept) ? accept.join(',') : (accept ?? '');
  const allowed = new Set<string>();
  for (const part of text.toLowerCase().split(',')) {
    const [name, ...params] = part.trim().split(';');
    const q = params.map((p) => /^\s*q=([\d.]+)\s*$/.exec(p)?.[1]).find((x) => x !== undefined);
    if (name && (q === undefined || Number(q) > 0)) allowed.add(name.trim());
  }
  if (allowed.has(prefer)) return prefer;
  if (allowed.has('gzip')) return 'gzip';
  if (allowed.has('br')) return 'br';
  return null;
}

/** Default bound of a ResponseCache on the bytes it keeps (form texts, answers and their compressed bodies). */
export const RESPONSE_CACHE_MAX_BYTES = 8 * 1024 * 1024;

/** Bytes an entry holds: its form text (counted at two bytes a character, as the heap may keep it), the answer and its compressed bodies. */
function entryBytes(e: Entry): number {
  let n = 2 * e.source.length + e.utf8.length;
  for (const b of e.encoded.values()) n += b.length;
  return n;
}

/**
 * Bounded twice: at most `capacity` entries and at most `maxBytes` bytes kept (entryBytes, the compressed bodies
 * counted as they are added; by default 8 MB, about 60 recompute answers of the demo's size); the least recently
 * used entries go first.
 */
export class ResponseCache {
  private readonly entries = new Map<string, Entry>();
  private kept = 0;
  hits = 0;
  misses = 0;

  constructor(
    readonly capacity = 200,
    readonly maxBytes = RESPONSE_CACHE_MAX_BYTES,
  ) {}

  /** Bytes kept now (entryBytes summed). */
  get bytes(): number {
    return this.kept;
  }

  get size(): number {
    return this.entries.size;
  }

  /** The cached answer for this form text, else make it (and keep it when `keep` says so); '' is never cached. */
  answer(source: string, make: () => CachedAnswer, keep: (a: CachedAnswer) => boolean = () => true): Answer {
    if (source === '') return make(); // not cacheable (see the caller)
    const key = createHash('sha256').update(source).digest('base64');
    const hit = this.entries.get(key);
    if (hit && hit.source === source) {
      this.entries.delete(key); // most recently used goes last
      this.entries.set(key, hit);
      this.hits++;
      return { status: hit.status, entry: hit };
    }
    this.misses++;
    const made = make();
    if (!keep(made)) return made;
    const entry: Entry = { status: made.status, source, utf8: Buffer.from(made.body.html, 'utf8'), encoded: new Map(), cache: this, key };
    if (hit) this.remove(key, hit);
    this.entries.set(key, entry);
    this.grow(entryBytes(entry));
    while (this.entries.size > this.capacity) this.evictOldest();
    return { status: made.status, entry };
  }

  /** Counts bytes added to an entry (a compressed body) while it is kept, and evicts the oldest entries while over the bound. */
  added(entry: Entry, bytes: number): void {
    if (this.entries.get(entry.key) !== entry) return; // evicted meanwhile: nothing of it is kept
    this.grow(bytes);
  }

  private grow(bytes: number): void {
    this.kept += bytes;
    // the newest entry stays even when it alone is over the bound (it is being answered)
    while (this.kept > this.maxBytes && this.entries.size > 1) this.evictOldest();
  }

  private evictOldest(): void {
    const key = this.entries.keys().next().value!;
    this.remove(key, this.entries.get(key)!);
  }

  private remove(key: string, e: Entry): void {
    if (this.entries.get(key) !== e) return;
    this.entries.delete(key);
    this.kept -= entryBytes(e);
  }

  clear(): void {
    this.entries.clear();
    this.kept = 0;
  }
}

/**
 * Sends an answer: a kept one from its bytes, compressed once per entry and encoding (chooseEncoding); the
 * Content-Encoding header tells @fastify/compress to leave the body alone. The bytes are those of the SafeHtml
 * the answer was made from (views/html.ts), so only escaped-by-construction HTML leaves here too.
 */
export function sendCached(req: FastifyRequest, reply: FastifyReply, a: Answer): FastifyReply {
  if (!a.entry) return sendHtml(reply, a.body, a.status);
  const encoding = chooseEncoding(req.headers['accept-encoding']);
  reply.header('vary', 'accept-encoding');
  if (!encoding || a.entry.utf8.length < COMPRESS_THRESHOLD) return sendKeptHtml(reply, a.entry.utf8, a.status);
  let buf = a.entry.encoded.get(encoding);
  if (!buf) {
    buf = encoding === 'br' ? brotliCompressSync(a.entry.utf8, { params: { [constants.BROTLI_PARAM_QUALITY]: 1 } }) : gzipSync(a.entry.utf8, { level: 1 });
    a.entry.encoded.set(encoding, buf);
    a.entry.cache.added(a.entry, buf.length);
  }
  return sendKeptHtml(reply.header('content-encoding', encoding).header('content-length', buf.length), buf, a.status);
}
