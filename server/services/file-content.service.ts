// Checks of an uploaded file's CONTENT (its bytes, never its name or the browser's type), run
// before anything is stored. Each format's structure is walked far enough to refuse a damaged
// or disguised file without decoding it (no decompression, so no decompression bomb).
import { crc32 } from 'node:zlib';
import { AppError } from '../errors/app-error';

export function unsupportedContent(message: string, field = 'file'): AppError {
  return new AppError(415, 'unsupported_media_type', message, { fields: { [field]: message } });
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

export function looksLikePng(buf: Buffer): boolean {
  return buf.length >= 8 && buf.subarray(0, 8).equals(PNG_SIGNATURE);
}

export function looksLikeJpeg(buf: Buffer): boolean {
  return buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff;
}

/**
 * PNG chunk layout (PNG spec, 2nd ed., §5.3): length, type, data, CRC-32 of type + data.
 * IHDR first (§11.2.2), at least one IDAT, IEND last with nothing after it. Refuses a bad CRC,
 * a chunk running past the end, a missing IHDR/IDAT/IEND and bytes after IEND (a second file
 * hidden behind the image).
 */
export function checkPngStructure(buf: Buffer, field = 'file'): void {
  const damaged = (why: string) => unsupportedContent(`The PNG file is damaged or not a plain image: ${why}.`, field);
  let at = 8;
  let index = 0;
  let sawIdat = false;
  for (;;) {
    if (at + 12 > buf.length) throw damaged('it ends before its IEND chunk');
    const length = buf.readUInt32BE(at);
    const type = buf.toString('latin1', at + 4, at + 8);
    if (!/^[A-Za-z]{4}$/.test(type)) throw damaged(`chunk ${index + 1} has no valid type`);
    const end = at + 12 + length;
    if (length > 0x7fffffff || end > buf.length) throw damaged(`chunk ${type} runs past the end of the file`);
    const expected = buf.readUInt32BE(end - 4);
    if (crc32(buf.subarray(at + 4, end - 4)) !== expected) throw damaged(`chunk ${type} fails its CRC check`);
    if (index === 0 && (type !== 'IHDR' || length !== 13)) throw damaged('the first chunk is not IHDR');
    if (type === 'IDAT') sawIdat = true;
    at = end;
    index += 1;
    if (type === 'IEND') break;
  }
  if (!sawIdat) throw damaged('it holds no image data (IDAT)');
  if (at !== buf.length) throw damaged(`${buf.length - at} bytes follow the IEND chunk`);
}

/** JPEG (ITU-T T.81 Annex B): the image must end with the EOI marker (trailing zero padding allowed). */
export function checkJpegEnd(buf: Buffer, field = 'file'): void {
  let end = buf.length;
  while (end > 0 && buf[end - 1] === 0x00) end -= 1;
  if (end < 4 || buf[end - 2] !== 0xff || buf[end - 1] !== 0xd9) {
    throw unsupportedContent('The JPEG file is damaged or cut short: it does not end with the end-of-image marker.', field);
  }
}
