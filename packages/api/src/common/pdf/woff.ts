import { inflateSync } from 'node:zlib';

/**
 * A WOFF 1.0 font as the plain OpenType (sfnt) file it wraps (W3C WOFF File Format 1.0,
 * sections 3–5): each table inflated with zlib when stored compressed. fontkit reads WOFF
 * itself, but inflates every table in JavaScript each time a document opens the font, which
 * took most of a review plan's PDF; unwrapped once here, a document only parses the tables.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength) throw new Error('a WOFF table inflated to the wrong size');
    tables.push({ tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data });
  }
  // The sfnt offset table's binary-search fields (OpenType spec, "Table Directory").
  const power = 2 ** Math.floor(Math.log2(numTables));
  const head = Buffer.alloc(12 + numTables * 16);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(power * 16, 6);
  head.writeUInt16BE(Math.log2(power), 8);
  head.writeUInt16BE(numTables * 16 - power * 16, 10);
  const parts: Buffer[] = [head];
  let offset = head.length;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    head.writeUInt32BE(t.tag, at);
    head.writeUInt32BE(t.checksum, at + 4);
    head.writeUInt32BE(offset, at + 8);
    head.writeUInt32BE(t.data.length, at + 12);
    const padded = (t.data.length + 3) & ~3;
    parts.push(t.data, Buffer.alloc(padded - t.data.length));
    offset += padded;
  });
  return Buffer.concat(parts);
}
