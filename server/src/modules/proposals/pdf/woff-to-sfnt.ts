import { inflateSync } from 'node:zlib';

/**
 * A WOFF 1.0 font unwrapped into the plain TrueType/OpenType file it packs (W3C WOFF File Format 1.0,
 * §4–§5: a 44-byte header, 20-byte table entries, each table zlib-compressed unless its compressed length
 * equals its original length). react-pdf's fontkit reads WOFF, but it inflates a table again on every
 * access — every glyph drawn re-inflates the whole glyph table, most of a proposal's render time — so
 * the proposal's fonts are unwrapped once per process and handed over as plain sfnt files.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('Not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : raw;
    if (data.length !== origLength) throw new Error('A WOFF table does not inflate to its stated length');
    return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data };
  });

  const padded = (n: number) => (n + 3) & ~3;
  const headerSize = 12 + numTables * 16;
  const out = Buffer.alloc(headerSize + tables.reduce((sum, t) => sum + padded(t.data.length), 0));
  // The sfnt offset table (OpenType spec, "Table directory"): searchRange etc. from the largest power of two.
  const pow2 = 2 ** Math.floor(Math.log2(numTables));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(pow2 * 16, 6);
  out.writeUInt16BE(Math.log2(pow2), 8);
  out.writeUInt16BE(numTables * 16 - pow2 * 16, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += padded(t.data.length);
  });
  return out;
}
