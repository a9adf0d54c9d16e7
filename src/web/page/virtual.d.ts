/** The version of the build that wrote the page. */
declare const PLUMBLINE_PAGE_VERSION: string;

declare module 'pdfjs-dist/build/pdf.worker.mjs' {
  export const WorkerMessageHandler: unknown;
}
