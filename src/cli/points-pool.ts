/**
 * Order-keeping worker threads for long `probe --points` inputs: pieces of the input (whole
 * records, io/csv-cut.ts) are answered by a worker (points-worker.ts) and, when the worker is busy,
 * by the main thread itself (points-piece.ts, each with its own copy of the system); the results come back in
 * piece order whatever order they finish in.
 *
 * Steps: 1. `useWorkers` decides: only a file input of at least EPHMAP_POINTS_WORKERS_FROM bytes
 * (default 8 MiB; an internal setting for tests, see DEVELOPERS.md), only the fixed-activity
 * answerer, only on a machine with two cores or more, and only when the worker entry exists next
 * to this module (the bundle's points-worker.mjs, or tsc's points-worker.js); 2. `submit` numbers
 * a piece and hands it to the least busy worker holding fewer than WORKER_QUEUE pieces, else to the
 * main thread, which answers at once; 3. `next` waits for the oldest piece's result (an error there — a --strict bad row — is
 * thrown as the single-thread run throws it); the caller keeps few pieces in flight, so memory
 * stays bounded, and gives each written buffer back to the worker that filled it.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { InputError } from '../errors.js';
import type { PointsHeader } from '../report/points-csv.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { pieceAnswerer } from './points-piece.js';

/** What every worker starts from (structured-cloned). */
export interface PointsWorkerData {
  spec: SystemSpec;
  ref: string | CustomReference | undefined;
  name: string;
  sep: string;
  header: PointsHeader;
  strict: boolean;
}

export interface PieceJob {
  id: number;
  text: string;
  line: number;
  /** The input's last piece (its last record may lack a line end). */
  last: boolean;
}

export type PieceError = { kind: 'input'; file: string; field: string; expected: string; got?: string } | { kind: 'other'; message: string };
export type PieceDone = { id: number; bytes: Uint8Array; rows: number; failed: number };
export type PieceResult = PieceDone | { id: number; error: PieceError };

/**
 * Input characters per piece (about 3,000 rows; the output is about ten times as long). 10⁶ rows,
 * main thread + 1 worker, before rows were read one record at a time: peak RSS ~112 MB with 64 kB
 * pieces, ~123–136 MB with 32 kB (more pieces in flight for the same overlap), ~160 MB with 256 kB.
 */
export const PIECE_CHARS = 1 << 16;

/**
 * Pieces a worker may hold before the main thread answers the next piece itself. With 4 pieces in
 * flight (probe-points.ts), 2 keep the worker busy while the main thread reads, answers and
 * writes. 10⁶ rows on the idle 2-core test machine (alternating runs, ~2 µs per row): queue 2 with
 * 4 in flight 1.8–2.4 s at 99–103 MB peak RSS; queue 1 with 2 in flight 1.8–2.4 s at 97–102 MB;
 * queue 3 with 5 in flight 2.4–2.7 s at ~111 MB; the single-thread run 2.2–2.6 s at 77–80 MB.
 */
const WORKER_QUEUE = 2;

/** Inputs from this size (bytes) use workers, unless EPHMAP_POINTS_WORKERS_FROM says otherwise. */
const WORKERS_FROM = 8 << 20;

/** Step 1: the worker entry's path, or undefined (running from sources: no workers). */
export function workerEntry(): string | undefined {
  const here = import.meta.url;
  const name = here.endsWith('.mjs') ? './points-worker.mjs' : './points-worker.js';
  if (!here.startsWith('file:')) return undefined;
  const path = fileURLToPath(new URL(name, here));
  return existsSync(path) ? path : undefined;
}

/**
 * Step 1: whether an input file of `size` bytes is answered in pieces by the main thread and one
 * worker. Two workers (the main thread only reading and writing) were faster on an idle machine
 * but took 127–163 MB peak RSS for 10⁶ rows, beyond the 120 MB target (see DEVELOPERS.md).
 */
export function useWorkers(size: number, fixedActivity: boolean): boolean {
  const env = process.env.EPHMAP_POINTS_WORKERS_FROM;
  const from = env !== undefined && /^\d+$/.test(env) ? Number(env) : WORKERS_FROM;
  if (!fixedActivity || size < from || size === 0 || availableParallelism() < 2) return false;
  return workerEntry() !== undefined;
}

interface Slot {
  w: Worker;
}

interface Waiting {
  id: number;
  /** Who answers it: a worker, or the main thread. */
  slot: Slot | 'main';
  done: Promise<PieceResult>;
  resolve: (r: PieceResult) => void;
  reject: (e: unknown) => void;
}

/** The workers and the pieces in flight, oldest first (see the module comment). */
export class PointsPool {
  private readonly workers: Slot[] = [];
  private readonly waiting: Waiting[] = [];
  private nextId = 0;
  /** The main thread's own answerer (for the pieces that find every worker busy), when `local`. */
  private readonly local: ReturnType<typeof pieceAnswerer> | undefined;

  constructor(entry: string, data: PointsWorkerData, count: number, local = false) {
    this.local = local ? pieceAnswerer(data) : undefined;
    for (let k = 0; k < count; k++) {
      // No command-line options of the main thread: they may be a script (`node -e ...`).
      const w = new Worker(entry, { workerData: data, execArgv: [] });
      const slot = { w };
      w.on('message', (r: PieceResult) => {
        this.waiting.find((x) => x.id === r.id)?.resolve(r);
      });
      w.on('error', (e) => this.failAll(e));
      w.on('exit', (code) => this.failAll(new Error(`a points worker stopped (exit code ${code})`)));
      this.workers.push(slot);
    }
  }

  /** Pieces a worker holds (submitted, not yet taken by `next`). */
  private queued(w: Slot): number {
    let n = 0;
    for (const x of this.waiting) if (x.slot === w) n++;
    return n;
  }

  /** Pieces submitted and not yet taken by `next`. */
  get inFlight(): number {
    return this.waiting.length;
  }

  /** Step 2. */
  submit(text: string, line: number, last: boolean): void {
    const id = this.nextId++;
    let resolve!: (r: PieceResult) => void;
    let reject!: (e: unknown) => void;
    const done = new Promise<PieceResult>((res, rej) => ((resolve = res), (reject = rej)));
    done.catch(() => undefined); // handled when `next` takes it
    // The workers first, up to WORKER_QUEUE pieces each (so that they never wait for the main
    // thread's reading and writing); the main thread answers a piece itself when they are all busy.
    const slot = this.workers.reduce<Slot | undefined>((best, w) => (this.queued(w) < WORKER_QUEUE && (!best || this.queued(w) < this.queued(best)) ? w : best), undefined);
    if (!slot && this.local) {
      this.waiting.push({ id, slot: 'main', done, resolve, reject });
      return resolve(this.local.answer({ id, text, line, last }));
    }
    if (!slot) throw new Error('no worker free and no local answerer');
    this.waiting.push({ id, slot, done, resolve, reject });
    slot.w.postMessage({ id, text, line, last } satisfies PieceJob);
  }

  /**
   * Step 3: the oldest piece's bytes and row counts, and `written` to call once the bytes are
   * written (their buffer goes back to its worker for reuse).
   */
  async next(): Promise<{ piece: PieceDone; written: () => void }> {
    const head = this.waiting[0];
    if (!head) throw new Error('no piece in flight');
    const r = await head.done;
    this.waiting.shift();
    if ('bytes' in r) {
      const buffer = r.bytes.buffer as ArrayBuffer;
      const slot = head.slot;
      if (slot === 'main') return { piece: r, written: () => this.local!.give(buffer) };
      return { piece: r, written: () => void (this.workers.includes(slot) && slot.w.postMessage({ give: buffer }, [buffer])) };
    }
    const e = r.error;
    throw e.kind === 'input' ? new InputError(e.file, e.field, e.expected, e.got) : new Error(e.message);
  }

  /** Stops the workers (after the last piece, or when the run stops early). */
  async close(): Promise<void> {
    const all = this.workers.splice(0);
    await Promise.all(all.map((s) => s.w.terminate()));
  }

  /** A worker that fails stops the run as an internal error (never taken for a bad input file). */
  private failAll(e: unknown): void {
    if (!this.workers.length) return; // closed: the exits are ours
    const failure = new Error(`a worker thread of probe --points failed: ${e instanceof Error ? e.message : String(e)}`);
    for (const x of this.waiting) x.reject(failure);
  }
}
