/** Number formatting for messages: enough digits to see a difference, no more. */

/** A p-value: three significant digits, scientific below 1e-4. */
export function formatP(p: number): string {
  if (!Number.isFinite(p)) return String(p);
  if (p === 0) return '0';
  if (p < 1e-4) return p.toExponential(2).replace('e-', 'e-');
  return stripZeros(p.toPrecision(3));
}

/** A statistic or effect size: up to four decimals. */
export function formatValue(value: number, decimals = 4): string {
  if (!Number.isFinite(value)) return String(value);
  return stripZeros(value.toFixed(decimals));
}

export function formatRange(low: number, high: number, format: (value: number) => string = formatP): string {
  const lowText = format(low);
  const highText = format(high);
  return lowText === highText ? lowText : `${lowText} to ${highText}`;
}

function stripZeros(text: string): string {
  return text.includes('.') && !text.includes('e') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** Fills `{name}` placeholders of a message template. */
export function fillTemplate(template: string, data: Record<string, string | number>): string {
  return template.replace(/\{(\w+)\}/g, (whole, name: string) => (name in data ? String(data[name]) : whole));
}
