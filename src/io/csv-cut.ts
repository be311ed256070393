/**
 * CSV text cut into pieces at record boundaries, for answering pieces of a long series in parallel
 * (cli/points-pool.ts). A piece is whole records only, so each can be read on its own by a
 * CsvRecordReader started at the piece's first line number (csv-records.ts).
 *
 * The cut follows the reading rules of csv-records.ts (RFC 4180, IETF 2005) without building
 * fields — a state machine over the characters:
 *   - at the start of a field, `"` opens a quoted field; the separator starts the next field;
 *     LF, CRLF or a lone CR ends the record;
 *   - in an unquoted field (or after a closing quote) a quote is plain text; the separator and the
 *     line ends act as above;
 *   - in a quoted field, `""` is one quote, `"` closes it, LF counts a line (as the reader counts
 *     lines inside quotes) and nothing else ends anything.
 * Line numbers therefore advance as the reader's: one per record, plus one per LF inside quotes.
 * Outside quotes, a stretch up to the next LF that holds no quote and no CR is one whole record
 * (or the end of one): the scan jumps to that LF (indexOf) instead of stepping through it.
 * A piece ends after a record end once it holds at least `target` characters; a CR at the end of
 * the text seen so far waits for the next character (it may be a CRLF).
 *
 * Example: with target 1, `a,"x\ny"\nb\n` is cut into `a,"x\ny"\n` (first line 1) and `b\n`
 * (first line 3).
 */
import { InputError } from '../errors.js';
import { MAX_RECORD } from './csv-records.js';

/** Whole records of the input and the line number the first of them starts on. */
export interface CsvPiece {
  text: string;
  line: number;
}

const START = 0;
const PLAIN = 1;
const QUOTED = 2;

/** Incremental cutter (see the module comment). */
export class CsvCutter {
  private text = '';
  /** Scan position in `text`, state there, and the line counter (the reader's line there). */
  private pos = 0;
  private state = START;
  private line: number;
  /** Last record end in `text` and the line the record after it starts on. */
  private cut = 0;
  private cutLine: number;
  private pieceLine: number;
  private started = false;

  constructor(
    private readonly sep: string,
    private readonly file: string,
    private target: number,
    firstLine = 1,
  ) {
    this.line = this.cutLine = this.pieceLine = firstLine;
  }

  /** The pieces this chunk completes, in order. */
  push(chunk: string, out: CsvPiece[] = []): CsvPiece[] {
    this.text += chunk;
    if (!this.started && this.text.length) {
      // A byte-order mark is skipped by the reader: it is not a character of the first field.
      this.started = true;
      if (this.text.charCodeAt(0) === 0xfeff) this.pos = 1;
    }
    this.scan(out);
    if (this.text.length - this.cut > MAX_RECORD) {
      throw new InputError(this.file, `line ${this.cutLine}`, `a CSV record of at most ${MAX_RECORD} characters (an unclosed double quote?)`);
    }
    return out;
  }

  /** Pieces from now on hold at least `chars` characters (1: each record is a piece). */
  setTarget(chars: number): void {
    this.target = chars;
  }

  /** What is left at the end of input (possibly a last record without a line end). */
  end(): CsvPiece | undefined {
    const rest = this.text;
    this.text = '';
    return rest === '' ? undefined : { text: rest, line: this.pieceLine };
  }

  /** Steps the state machine to the end of the text, cutting pieces at record ends. */
  private scan(out: CsvPiece[]): void {
    const t = this.text;
    const sep = this.sep.charCodeAt(0);
    let i = this.pos;
    let state = this.state;
    let line = this.line;
    let pieceStart = 0;
    // Next LF, quote and CR at or after i (each found once and reused until passed; -1: none),
    // for the jump to the next LF: a few native searches per record, never one per character.
    let nl = -2;
    let q = -2;
    let cr = -2;
    while (i < t.length) {
      if (state !== QUOTED) {
        if (nl !== -1 && nl < i) nl = t.indexOf('\n', i);
        if (q !== -1 && q < i) q = t.indexOf('"', i);
        if (cr !== -1 && cr < i) cr = t.indexOf('\r', i);
        // Nothing before the next LF that the state machine would act on: straight to it (the
        // record end below takes it from there).
        if (nl >= 0 && (q < 0 || nl < q) && (cr < 0 || nl < cr)) i = nl;
      }
      const c = t.charCodeAt(i);
      if (state === QUOTED) {
        if (c === 34) {
          if (i + 1 >= t.length) break; // `"` or `""`: wait for the next character
          if (t.charCodeAt(i + 1) === 34) i += 2;
          else (state = PLAIN), i++;
          continue;
        }
        if (c === 10) line++;
        i++;
        continue;
      }
      if (c === 10 || c === 13) {
        // A record end (LF, CRLF or a lone CR).
        if (c === 13 && i + 1 >= t.length) break;
        i += c === 13 && t.charCodeAt(i + 1) === 10 ? 2 : 1;
        line++;
        state = START;
        this.cut = i;
        this.cutLine = line;
        if (i - pieceStart >= this.target) {
          out.push({ text: t.slice(pieceStart, i), line: this.pieceLine });
          pieceStart = i;
          this.pieceLine = line;
        }
        continue;
      }
      if (c === sep) state = START;
      else if (state === START) state = c === 34 ? QUOTED : PLAIN;
      i++;
    }
    // Keep only the text after the last piece.
    this.text = t.slice(pieceStart);
    this.pos = i - pieceStart;
    this.cut -= pieceStart;
    this.state = state;
    this.line = line;
  }
}
