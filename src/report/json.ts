import type { Report } from './model.js';

/** The JSON report (shape: src/report/model.ts, published as schema/report.schema.json). */
export function formatJson(report: Report): string {
  return `${JSON.stringify(report, null, 2)}\n`;
}
