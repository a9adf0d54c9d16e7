/** What a file's first bytes say it is, whatever its name says. */
export type ContentKind = 'empty' | 'pdf' | 'zip' | 'ole' | 'html' | 'xml' | 'rtf' | 'image' | 'binary' | 'text';

/**
 * Reads the magic bytes (and, for text, the first tag) of a file. Used to
 * refuse a mislabelled file with a message that says what it really is.
 */
export function sniffContent(bytes: Uint8Array): ContentKind {
  if (bytes.length === 0) return 'empty';
  const head = Buffer.from(bytes.subarray(0, 1024));
  if (head.includes('%PDF-', 0, 'latin1')) return 'pdf';
  if (head[0] === 0x50 && head[1] === 0x4b && (head[2] === 0x03 || head[2] === 0x05 || head[2] === 0x07)) return 'zip';
  if (head.subarray(0, 8).equals(Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]))) return 'ole';
  if (head.subarray(0, 5).toString('latin1') === '{\\rtf') return 'rtf';
  if (isImage(head)) return 'image';
  if (head.includes(0)) return 'binary';
  const start = head.toString('utf8').replace(/^\uFEFF/, '').trimStart().slice(0, 400).toLowerCase();
  if (/^<!doctype html|^<html[\s>]|^<head[\s>]|^<body[\s>]/.test(start) || (/^<!--/.test(start) && start.includes('<html'))) return 'html';
  if (/^<\?xml|^<!doctype article|^<article[\s>]/.test(start)) return start.includes('<html') ? 'html' : 'xml';
  return 'text';
}

function isImage(head: Buffer): boolean {
  const png = head[0] === 0x89 && head.subarray(1, 4).toString('latin1') === 'PNG';
  const jpeg = head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff;
  const gif = head.subarray(0, 4).toString('latin1') === 'GIF8';
  const tiff = ['II*\u0000', 'MM\u0000*'].includes(head.subarray(0, 4).toString('latin1'));
  return png || jpeg || gif || tiff;
}

/** Words for a content kind in an error message ("the file is really ..."). */
export function describeContent(kind: ContentKind): string {
  switch (kind) {
    case 'empty': return 'empty';
    case 'pdf': return 'a PDF';
    case 'zip': return 'a zip archive (such as a DOCX)';
    case 'ole': return 'an old binary Office file (.doc) or a password-protected Office document';
    case 'html': return 'an HTML page';
    case 'xml': return 'an XML document';
    case 'rtf': return 'an RTF document';
    case 'image': return 'an image';
    case 'binary': return 'binary data';
    case 'text': return 'plain text';
  }
}
