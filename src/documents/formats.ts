/** The document formats plumbline reads, by file extension (kept apart from the readers, which are heavy to load). */
export type DocumentFormat = 'text' | 'markdown' | 'pdf' | 'docx' | 'html' | 'jats' | 'latex';

export const formatByExtension: Record<string, DocumentFormat> = {
  '.txt': 'text',
  '.text': 'text',
  '.md': 'markdown',
  '.markdown': 'markdown',
  '.pdf': 'pdf',
  '.docx': 'docx',
  '.html': 'html',
  '.htm': 'html',
  '.xhtml': 'html',
  '.xml': 'jats',
  '.nxml': 'jats',
  '.tex': 'latex',
  '.ltx': 'latex',
};

export const supportedExtensions = Object.keys(formatByExtension);

export function isSupported(path: string): boolean {
  const dot = path.lastIndexOf('.');
  return dot > path.lastIndexOf('/') && path.slice(dot).toLowerCase() in formatByExtension;
}
