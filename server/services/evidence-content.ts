// Decides what an uploaded file really is from its bytes, never from the
// client's claimed type. Binary formats by their magic numbers (file-type);
// text has none, so CSV and plain text are accepted only when every byte is
// valid UTF-8 without NULs and the name ends .csv or .txt.
import { createReadStream } from 'node:fs';
import path from 'node:path';
import { fileTypeFromFile } from 'file-type';
import { AppError } from '../lib/app-error';
import { EVIDENCE_ACCEPT_HINT, type EvidenceMediaType } from '../../shared/schemas/evidence';

const BINARY_TYPES: Record<string, { mediaType: EvidenceMediaType; extensions: string[] }> = {
  'application/pdf': { mediaType: 'application/pdf', extensions: ['.pdf'] },
  'image/png': { mediaType: 'image/png', extensions: ['.png'] },
  'image/jpeg': { mediaType: 'image/jpeg', extensions: ['.jpg', '.jpeg'] },
};

const TEXT_TYPES: Record<string, EvidenceMediaType> = { '.csv': 'text/csv', '.txt': 'text/plain' };

const unsupported = (message: string) =>
  new AppError(`${message} Whorl accepts ${EVIDENCE_ACCEPT_HINT}.`, { status: 415, code: 'unsupported_media_type' });

/** Valid UTF-8 throughout and no NUL byte (binary formats without a magic number fail here). */
async function isUtf8Text(filePath: string): Promise<boolean> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  try {
    for await (const chunk of createReadStream(filePath)) {
      const bytes = chunk as Buffer;
      if (bytes.includes(0)) return false;
      decoder.decode(bytes, { stream: true });
    }
    decoder.decode();
    return true;
  } catch {
    return false;
  }
}

/** The media type to store, or a 415 AppError naming the problem. */
export async function detectEvidenceType(filePath: string, fileName: string, sizeBytes: number): Promise<EvidenceMediaType> {
  if (sizeBytes === 0) throw new AppError(`“${fileName}” is empty.`, { status: 400, code: 'empty_file' });
  const extension = path.extname(fileName).toLowerCase();
  const detected = await fileTypeFromFile(filePath);
  if (detected) {
    const allowed = BINARY_TYPES[detected.mime];
    if (!allowed) throw unsupported(`“${fileName}” contains ${detected.mime} (.${detected.ext}) data, which is not accepted as evidence.`);
    if (!allowed.extensions.includes(extension)) {
      throw unsupported(`“${fileName}” is named ${extension || 'without an extension'} but its content is ${detected.mime}; rename it ${allowed.extensions[0]} if that is what it is.`);
    }
    return allowed.mediaType;
  }
  const textType = TEXT_TYPES[extension];
  if (!textType) {
    throw unsupported(`The content of “${fileName}” does not match its name (${extension || 'no extension'}), or is a format that is not accepted.`);
  }
  if (!(await isUtf8Text(filePath))) {
    throw unsupported(`“${fileName}” is named ${extension} but is not UTF-8 text (export it as UTF-8 CSV or plain text).`);
  }
  return textType;
}

/** U+200E/U+200F marks, U+202A–U+202E embeddings and overrides, U+2066–U+2069 isolates. */
export const BIDI_CONTROLS = /[\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

/**
 * A file name safe to store and to send back: no folders (“../../x.pdf” → “x.pdf”),
 * no control characters, no bidirectional controls (a right-to-left override
 * makes “invoice_fdp.exe” read as “invoice_exe.pdf”), at most 200 characters,
 * never empty.
 */
export function safeFileName(original: string | undefined): string {
  const base = (original ?? '').split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  let name = base
    .replace(BIDI_CONTROLS, '')
    .replace(/[\u0000-\u001f\u007f"<>|:*?]/g, '_')
    .replace(/^[.\s]+/, '')
    .trim();
  if (name.length > 200) {
    const extension = path.extname(name).slice(0, 16);
    name = name.slice(0, 200 - extension.length) + extension;
  }
  // Cutting at 200 may split a surrogate pair; never store half a character.
  return (name as string & { toWellFormed(): string }).toWellFormed() || 'evidence';
}
