/**
 * Colour for the terminal: only when standard output is a terminal, and never when the NO_COLOR environment
 * variable is set to a non-empty value (the https://no-color.org convention). Reports stay plain text in the core;
 * colour is added here, line by line, to text the core already formatted.
 */
import type { CliIo } from './io';

const codes = {
  red: '\x1b[31m',
  yellow: '\x1b[33m',
  blue: '\x1b[34m',
  green: '\x1b[32m',
  dim: '\x1b[2m',
  bold: '\x1b[1m',
} as const;
const reset = '\x1b[0m';

export type Colour = keyof typeof codes;

/** True when the output may be coloured: stdout is a terminal and NO_COLOR is unset or empty. */
export function colourEnabled(io: CliIo): boolean {
  const noColor = io.env?.NO_COLOR;
  return io.terminal?.stdout === true && (noColor === undefined || noColor === '');
}

export function paint(text: string, colour: Colour): string {
  return `${codes[colour]}${text}${reset}`;
}

const severityColour: Readonly<Record<string, Colour>> = { error: 'red', warning: 'yellow', info: 'blue', hint: 'dim' };

/** A check report line (`path:line:column: severity CODE message`) with its severity coloured; other lines as is. */
export function colourCheckLine(line: string): string {
  const m = /^(.*?:\d+:\d+: )(error|warning|info|hint)( KW\d{3} .*)$/.exec(line);
  if (m) return `${m[1]}${paint(m[2], severityColour[m[2]])}${m[3]}`;
  const summary = /^(checked .*?: )(\d+) (errors?)(, )(\d+) (warnings?)(.*)$/.exec(line);
  if (summary) {
    const errors = summary[2] === '0' ? `${summary[2]} ${summary[3]}` : paint(`${summary[2]} ${summary[3]}`, 'red');
    const warnings = summary[5] === '0' ? `${summary[5]} ${summary[6]}` : paint(`${summary[5]} ${summary[6]}`, 'yellow');
    return `${summary[1]}${errors}${summary[4]}${warnings}${summary[7]}`;
  }
  return line;
}

/** A compare report line with flips in red, additions in green, removals and exceeded limits in yellow. */
export function colourCompareLine(line: string): string {
  if (/ flipped: /.test(line)) return paint(line, 'red');
  if (/^limits exceeded:/.test(line)) return paint(line, 'red');
  if (/: added( \(line \d+\))?$/.test(line)) return paint(line, 'green');
  if (/: removed( \(line \d+\))?$/.test(line)) return paint(line, 'yellow');
  if (/^\S.*: (modified|file added|file removed)$/.test(line)) return paint(line, 'bold');
  return line;
}

/** Colours each line of `text` with `colourLine` when colour is enabled. */
export function colourText(text: string, io: CliIo, colourLine: (line: string) => string): string {
  if (!colourEnabled(io)) return text;
  return text.split('\n').map(colourLine).join('\n');
}
