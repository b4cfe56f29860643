/*
 * A company logo is read by its bytes, never by its name or declared type: a PNG or a JPEG whose
 * structure is whole, at most LOGO_LIMITS pixels on a side so that a small file cannot unpack
 * into a huge bitmap (a decompression bomb) when the PDF writer decodes it.
 */

export const LOGO_LIMITS = { maxBytes: 1024 * 1024, maxSide: 4000 } as const;

export interface CheckedLogo {
  type: 'image/png' | 'image/jpeg';
  width: number;
  height: number;
}

/** Why a file is not a logo: 'unsupported' (not a PNG or JPEG at all, 415) or 'broken' (422). */
export class LogoRefusal extends Error {
  constructor(
    readonly kind: 'unsupported' | 'broken',
    message: string,
  ) {
    super(message);
  }
}

const pngSignature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** CRC-32 of the PNG specification (ISO/IEC 15948, Annex D): polynomial 0xEDB88320, reflected. */
const crcTable = Uint32Array.from({ length: 256 }, (_, byte) => {
  let crc = byte;
  for (let bit = 0; bit < 8; bit += 1) crc = crc & 1 ? 0xedb88320 ^ (crc >>> 1) : crc >>> 1;
  return crc >>> 0;
});

export function crc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const byte of bytes) crc = crcTable[(crc ^ byte) & 0xff] ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

function checkedSides(width: number, height: number): { width: number; height: number } {
  if (width < 1 || height < 1) throw new LogoRefusal('broken', 'the image has no pixels');
  if (width > LOGO_LIMITS.maxSide || height > LOGO_LIMITS.maxSide)
    throw new LogoRefusal(
      'broken',
      `the image is ${width} x ${height} pixels; at most ${LOGO_LIMITS.maxSide} x ${LOGO_LIMITS.maxSide}`,
    );
  return { width, height };
}

/** Walks every chunk (ISO/IEC 15948 section 5.3): IHDR first, CRCs right, IDAT present, nothing after IEND. */
function checkedPng(bytes: Buffer): CheckedLogo {
  let offset = pngSignature.length;
  let sides: { width: number; height: number } | null = null;
  let sawData = false;
  while (offset < bytes.length) {
    if (offset + 12 > bytes.length) throw new LogoRefusal('broken', `a PNG chunk is cut short at byte ${offset}`);
    const length = bytes.readUInt32BE(offset);
    const type = bytes.toString('latin1', offset + 4, offset + 8);
    const end = offset + 12 + length;
    if (length > 0x7fffffff || end > bytes.length)
      throw new LogoRefusal('broken', `the PNG chunk ${JSON.stringify(type)} at byte ${offset} runs past the file`);
    const stored = bytes.readUInt32BE(end - 4);
    if (crc32(bytes.subarray(offset + 4, end - 4)) !== stored)
      throw new LogoRefusal('broken', `the PNG chunk ${JSON.stringify(type)} at byte ${offset} has a wrong CRC`);
    if (sides === null && type !== 'IHDR') throw new LogoRefusal('broken', 'a PNG starts with its IHDR chunk');
    if (type === 'IHDR') {
      if (sides !== null || length !== 13) throw new LogoRefusal('broken', 'the PNG has a malformed IHDR chunk');
      sides = checkedSides(bytes.readUInt32BE(offset + 8), bytes.readUInt32BE(offset + 12));
    }
    if (type === 'IDAT') sawData = true;
    offset = end;
    if (type === 'IEND') {
      if (offset !== bytes.length)
        throw new LogoRefusal('broken', `${bytes.length - offset} bytes follow the PNG's IEND chunk`);
      if (!sawData) throw new LogoRefusal('broken', 'the PNG has no image data');
      return { type: 'image/png', ...sides! };
    }
  }
  throw new LogoRefusal('broken', 'the PNG has no IEND chunk');
}

/** Start-of-frame markers (ITU-T T.81, table B.1): C0-CF except DHT C4, JPG C8 and DAC CC. */
function isFrameMarker(marker: number): boolean {
  return marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
}

/** Walks the marker segments up to the scan (ITU-T T.81, annex B): a frame header first, SOI to EOI. */
function checkedJpeg(bytes: Buffer): CheckedLogo {
  if (bytes[bytes.length - 2] !== 0xff || bytes[bytes.length - 1] !== 0xd9)
    throw new LogoRefusal('broken', 'the JPEG does not end with its EOI marker');
  let offset = 2;
  let sides: { width: number; height: number } | null = null;
  while (offset + 4 <= bytes.length) {
    if (bytes[offset] !== 0xff) throw new LogoRefusal('broken', `no JPEG marker at byte ${offset}`);
    const marker = bytes[offset + 1];
    if (marker === 0xff) {
      offset += 1; // fill byte
      continue;
    }
    const length = bytes.readUInt16BE(offset + 2);
    if (length < 2 || offset + 2 + length > bytes.length)
      throw new LogoRefusal('broken', `the JPEG segment at byte ${offset} runs past the file`);
    if (isFrameMarker(marker)) {
      if (length < 8) throw new LogoRefusal('broken', 'the JPEG has a malformed frame header');
      sides = checkedSides(bytes.readUInt16BE(offset + 7), bytes.readUInt16BE(offset + 5));
    }
    if (marker === 0xda) {
      if (!sides) throw new LogoRefusal('broken', 'the JPEG scan comes before any frame header');
      return { type: 'image/jpeg', ...sides };
    }
    offset += 2 + length;
  }
  throw new LogoRefusal('broken', 'the JPEG has no image scan');
}

/** The logo's type and size when its bytes are a whole PNG or JPEG within the limits; a LogoRefusal otherwise. */
export function checkedLogo(bytes: Buffer): CheckedLogo {
  if (bytes.length > LOGO_LIMITS.maxBytes)
    throw new LogoRefusal('broken', `the file is larger than ${LOGO_LIMITS.maxBytes} bytes`);
  if (bytes.length >= pngSignature.length && bytes.subarray(0, pngSignature.length).equals(pngSignature))
    return checkedPng(bytes);
  if (bytes.length >= 4 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return checkedJpeg(bytes);
  throw new LogoRefusal('unsupported', 'the file is neither a PNG nor a JPEG image');
}
