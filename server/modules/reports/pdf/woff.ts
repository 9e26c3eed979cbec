// Unwraps a WOFF 1.0 font into the plain TrueType/OpenType file it compresses.
//
// Why: the font reader inside pdfkit reads each WOFF table as a separate buffer, and it reads a
// glyph header even for an empty glyph (a space has no outline). When the empty glyph is the last
// one in the glyph table, as the space is in IBM Plex Mono, that read runs off the end of the buffer
// and rendering throws. In a plain font file the tables sit back to back, so the same read lands in
// the next table and does no harm. The format is small: a header, a table directory, and each
// table stored either as is or deflated with zlib.
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const WOFF_HEADER = 44;
const WOFF_ENTRY = 20;
const SFNT_HEADER = 12;
const SFNT_ENTRY = 16;

interface Table {
  tag: number;
  checksum: number;
  data: Buffer;
}

const align4 = (n: number) => (n + 3) & ~3;

export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER || woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('Not a WOFF 1.0 font.');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: Table[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER + i * WOFF_ENTRY;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength) throw new Error('A WOFF table does not unpack to its stated length.');
    tables.push({ tag, checksum, data });
  }
  tables.sort((a, b) => a.tag - b.tag);

  const dataStart = SFNT_HEADER + SFNT_ENTRY * numTables;
  // A little slack at the end, so that no read just past the last table can fail either.
  const total = tables.reduce((t, table) => t + align4(table.data.length), dataStart) + 16;
  const out = Buffer.alloc(total);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = dataStart;
  tables.forEach((table, i) => {
    const at = SFNT_HEADER + i * SFNT_ENTRY;
    out.writeUInt32BE(table.tag, at);
    out.writeUInt32BE(table.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(table.data.length, at + 12);
    table.data.copy(out, offset);
    offset += align4(table.data.length);
  });
  return out;
}
