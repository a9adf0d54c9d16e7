import { describe, expect, it } from 'vitest';
import { escapeOf, visibleControls, visibleLine } from '../../src/report/visible.js';

/** Every character src/report/visible.ts must never let through raw: C0, DEL, C1, bidi overrides and isolates. */
const ALL_HIDDEN = [
  ...Array.from({ length: 0x20 }, (_, code) => code),
  ...Array.from({ length: 0x21 }, (_, index) => 0x7f + index),
  0x202a, 0x202b, 0x202c, 0x202d, 0x202e, 0x2066, 0x2067, 0x2068, 0x2069,
].map((code) => String.fromCharCode(code));

const ANY_HIDDEN = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

describe('visibleControls', () => {
  it('writes C0 controls, DEL and C1 controls as \\x and two hex digits, bidi controls as \\u and four', () => {
    expect(escapeOf('\u001b')).toBe('\\x1b');
    expect(escapeOf('\u0000')).toBe('\\x00');
    expect(escapeOf('\u007f')).toBe('\\x7f');
    expect(escapeOf('\u009b')).toBe('\\x9b');
    expect(escapeOf('\u202e')).toBe('\\u202e');
    expect(escapeOf('\u2066')).toBe('\\u2066');
  });

  it('leaves no control character of any kind, and keeps everything else as it was', () => {
    const text = ALL_HIDDEN.join('|');
    const visible = visibleControls(text);
    expect(visible).not.toMatch(ANY_HIDDEN);
    expect(visible.split('|')).toEqual(ALL_HIDDEN.map(escapeOf));
    const ordinary = 'F(2, 57) = 4.21, p < .05, ηp² = .13 – “quoted” \\ backslash, η, ≤, −, Ω, 日本, \u200e mark, \u00a0 no-break space';
    expect(visibleControls(ordinary)).toBe(ordinary);
  });

  it('shows each sequence a terminal would obey as text: cursor moves, clear screen, window title, hyperlink, right-to-left override', () => {
    expect(visibleControls('a\u001b[2Ab\u001b[2J')).toBe('a\\x1b[2Ab\\x1b[2J');
    expect(visibleControls('\u001b]0;title\u0007')).toBe('\\x1b]0;title\\x07');
    expect(visibleControls('\u001b]8;;http://example.invalid\u001b\\click\u001b]8;;\u001b\\')).toBe('\\x1b]8;;http://example.invalid\\x1b\\click\\x1b]8;;\\x1b\\');
    expect(visibleControls('report\u202etxt.exe')).toBe('report\\u202etxt.exe');
    expect(visibleControls('\u009b2J')).toBe('\\x9b2J'); // the one-character CSI
  });

  it('keeps the characters a format asks for, and only those', () => {
    expect(visibleControls('a\tb\nc\rd\u001be', '\t\n\r')).toBe('a\tb\nc\rd\\x1be');
    expect(visibleControls('a\tb\nc\rd', '\n')).toBe('a\\x09b\nc\\x0dd');
    expect(visibleControls('a\tb\nc\rd')).toBe('a\\x09b\\x0ac\\x0dd');
  });
});

describe('visibleLine', () => {
  it('puts text on one line as the reports always have, then makes the controls left visible', () => {
    expect(visibleLine('  F(2,\r\n 57) = 4.21,\tp = .02  ')).toBe('F(2, 57) = 4.21, p = .02');
    expect(visibleLine('F(2, 57)\u001b[2J = 4.21\u202e')).toBe('F(2, 57)\\x1b[2J = 4.21\\u202e');
    expect(visibleLine('a\u000bb\u000cc')).toBe('a b c'); // vertical tab and form feed are white space, like a line break
  });
});
