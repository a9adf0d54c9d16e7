/**
 * The text of a markup file's bytes (HTML, JATS, LaTeX): UTF-8 unless a
 * declaration near the top names another charset the platform decodes.
 * Pure, so the command line's reader and the web page decode alike.
 */
export function decodeMarkup(bytes: Uint8Array): string {
  let head = '';
  for (const byte of bytes.subarray(0, 1024)) head += String.fromCharCode(byte);
  const declared = /(?:charset|encoding)\s*=\s*["']?([A-Za-z0-9_-]+)/i.exec(head)?.[1];
  if (declared && !/^utf-?8$/i.test(declared)) {
    try {
      return new TextDecoder(declared).decode(bytes);
    } catch {
      // an unknown label: fall back to UTF-8
    }
  }
  return new TextDecoder('utf-8').decode(bytes);
}
