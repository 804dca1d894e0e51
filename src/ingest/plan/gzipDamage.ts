/**
 * Is a gzip file whole? DuckDB reads a truncated gzip (a copy cut short, an interrupted download)
 * up to the cut and says nothing, so every row after it would be lost without a word. zlib checks
 * what DuckDB does not: that the compressed data reaches its end marker and that the CRC-32 and
 * length in the gzip trailer match (RFC 1952, section 2.3.1). So each gzipped log is decompressed
 * once here, streamed (constant memory), before DuckDB reads it.
 */
import { createReadStream } from 'node:fs';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';

/**
 * Why a gzip file cannot be trusted, or null when it is whole (every member ends with a trailer
 * whose checks pass). Never throws: a file that cannot be opened gives its error code as the reason.
 * Cost: one streamed decompression of the file (zlib's speed, about 0.3 to 1 GB of text per
 * second), O(1) memory. Example: `await gzipDamage('log.csv.gz')` is null for a file written by `gzip`;
 * the first half of that file gives "the gzip data ends before its end marker ...".
 */
export async function gzipDamage(file: string): Promise<string | null> {
  const sink = new Writable({
    write(_chunk, _encoding, done) {
      done();
    },
  });
  try {
    await pipeline(createReadStream(file), createGunzip(), sink);
    return null;
  } catch (error) {
    const e = error as NodeJS.ErrnoException;
    if (e.code === 'Z_BUF_ERROR')
      return (
        'the gzip data ends before its end marker (a truncated file or an interrupted download); none of its ' +
        'rows were used'
      );
    if (e.code === 'Z_DATA_ERROR') return `damaged gzip data (${e.message}); none of its rows were used`;
    return e.code ?? (String(e.message ?? error).split('\n')[0] as string);
  }
}
