/**
 * Standard output and error of the command line, written with fs.writeSync on the descriptors rather than
 * through process.stdout / process.stderr: those streams are made on first use and load node's stream,
 * net and tty modules — several milliseconds of a small call. A descriptor that is non-blocking (EAGAIN)
 * hands the rest to the stream, which waits for the reader.
 */
import { writeSync } from 'node:fs';

/** Output is gathered into buffers of about this size before each write. */
const CHUNK = 1 << 20;

/** Exit status when the reader has gone (`… | head`): end quietly, as a pipe's writer does. */
function readerGone(): never {
  process.exit(process.exitCode ?? 0);
}

function failed(err: NodeJS.ErrnoException): never {
  writeError(`error: cannot write output (${err.code ?? err.message})\n`);
  process.exit(1);
}

/** Writes all of buf to fd 1; returns the part not written when the descriptor would block. */
function writeAll(buf: Buffer): Buffer | undefined {
  let off = 0;
  while (off < buf.length) {
    try {
      off += writeSync(1, buf, off, buf.length - off);
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      if (code === 'EAGAIN') return buf.subarray(off);
      if (code === 'EPIPE') readerGone();
      failed(err as NodeJS.ErrnoException);
    }
  }
  return undefined;
}

/** Writes through the stream (a non-blocking descriptor), resolving once the stream has taken it. */
function writeStream(buf: Buffer): Promise<void> {
  const stdout = process.stdout;
  if (stdout.listenerCount('error') === 0) {
    stdout.on('error', (err: NodeJS.ErrnoException) => (err.code === 'EPIPE' ? readerGone() : failed(err)));
  }
  return new Promise((resolve) => {
    if (stdout.write(buf)) resolve();
    else stdout.once('drain', resolve);
  });
}

/** Writes the pieces (text, or bytes of UTF-8) to standard output in order, in large writes. */
export async function writeOutput(out: Iterable<string | Iterable<string | Uint8Array>>): Promise<void> {
  let viaStream = false;
  let pending: string[] = [];
  let size = 0;
  const write = async (buf: Uint8Array) => {
    const bytes = Buffer.isBuffer(buf) ? buf : Buffer.from(buf.buffer, buf.byteOffset, buf.byteLength);
    if (!viaStream) {
      const rest = writeAll(bytes);
      if (!rest) return;
      viaStream = true;
      await writeStream(rest);
    } else {
      await writeStream(bytes);
    }
  };
  const flush = async () => {
    if (!pending.length) return;
    const text = pending.length === 1 ? pending[0] : pending.join('');
    pending = [];
    size = 0;
    await write(Buffer.from(text, 'utf8'));
  };
  for (const part of out) {
    for (const piece of typeof part === 'string' ? [part] : part) {
      if (typeof piece === 'string') {
        pending.push(piece);
        size += piece.length;
        if (size >= CHUNK) await flush();
      } else {
        await flush();
        await write(piece);
      }
    }
  }
  await flush();
}

/** Writes a line to standard error (the one `error: …` line of a failed call). */
export function writeError(text: string): void {
  try {
    writeSync(2, text);
  } catch {
    process.stderr.write(text);
  }
}
