// Photos and measurement files on pins: multipart uploads up to a size limit, whose type is judged from the
// content (magic bytes through file-type; CSV as valid UTF-8 text), never from the name alone.
import multer from 'multer';
import { fileTypeFromBuffer } from 'file-type';
import { badRequest } from '../../http/errors';

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
const ALLOWED = new Set(['image/png', 'image/jpeg', 'image/webp', 'image/gif', 'application/pdf']);

export const uploadOne = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_ATTACHMENT_BYTES, files: 1 } }).single('file');

export async function judgeAttachment(fileName: string, content: Buffer): Promise<string> {
  const detected = await fileTypeFromBuffer(content);
  if (detected) {
    if (ALLOWED.has(detected.mime)) return detected.mime;
    throw badRequest(`${fileName} is a ${detected.mime} file; attach a photo (PNG, JPEG, WebP, GIF), a PDF or a CSV`, [{ path: 'file', message: 'type not allowed' }]);
  }
  const looksCsv = /\.csv$/i.test(fileName) && !content.includes(0);
  if (looksCsv) {
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(content);
      return 'text/csv';
    } catch {
      // fall through: not text
    }
  }
  throw badRequest(`${fileName} is not a photo, a PDF or a CSV file`, [{ path: 'file', message: 'type not recognised from its content' }]);
}
