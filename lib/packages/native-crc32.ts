// archiver's zip-stream computes every entry's CRC-32 with the pure-JS `crc-32` package: the largest CPU cost of a
// package in bench/package.ts (profiled: crc32_buf ≈ 3 s of CPU per GiB). Node's zlib.crc32 (Node ≥ 20.15) computes
// the same CRC-32 (ISO-HDLC, reflected 0xEDB88320) natively, several times faster, so crc-32's `buf` is routed to it.
import * as crc32Module from 'crc-32';
import { crc32 as zlibCrc32 } from 'node:zlib';

type Crc32Exports = { buf: (data: number[] | Uint8Array, seed?: number) => number };
type NativeBuf = Crc32Exports['buf'] & { native?: true };

// The CommonJS exports object that zip-stream and crc32-stream also import (the namespace itself is read-only).
const shared = ((crc32Module as unknown as { default?: Crc32Exports }).default ?? crc32Module) as Crc32Exports;

/** Routes crc-32's buf to zlib.crc32 (same results, signed as crc-32 returns them); true when in effect. */
export function routeCrc32ToZlib(): boolean {
  if (typeof zlibCrc32 !== 'function') return false;
  if ((shared.buf as NativeBuf).native) return true;
  const js = shared.buf;
  // crc-32 reads any seed as ToInt32 (a Buffer or undefined counts as 0); >>> 0 gives zlib the same 32 bits.
  const native: NativeBuf = (data, seed) => (ArrayBuffer.isView(data) ? zlibCrc32(data, (seed as number) >>> 0) | 0 : js(data, seed));
  native.native = true;
  try {
    shared.buf = native;
  } catch {
    return false;
  }
  return (shared.buf as NativeBuf).native === true;
}
