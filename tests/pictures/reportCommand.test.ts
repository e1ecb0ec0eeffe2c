/**
 * `kernwright report` as a function of its arguments: the options it accepts and refuses, where it writes, what it
 * prints, and its exit codes (0 written, 2 bad usage, unreadable input or unwritable output). Run in-process with
 * string buffers for the streams, on small files in a temporary folder.
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defaultReportPath, parseReportArgs, runReportCommand } from '../../server/src/cli/reportCommand';
import type { CliIo } from '../../server/src/cli/io';

const header = '# Invented test scenario; the values mean nothing beyond this test.\n';
let work = '';

function io(): CliIo & { stdout: string[]; stderr: string[] } {
  const stdout: string[] = [];
  const stderr: string[] = [];
  return { stdout, stderr, out: (t) => stdout.push(t), err: (l) => stderr.push(l) };
}

function write(name: string, text: string): string {
  const file = path.join(work, name);
  writeFileSync(file, text);
  return file;
}

beforeAll(() => {
  work = mkdtempSync(path.join(os.tmpdir(), 'kw-report-'));
});

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

describe('report arguments', () => {
  it.each([
    [['a.kw'], { file: 'a.kw', output: undefined, kernels: [], eigenCount: 16, eigenfunctions: 4, gridPoints: 48, timeBudgetMs: undefined }],
    [['-o', 'out.html', 'a.kw', '--kernel', 'k', '--kernel=m'], { file: 'a.kw', output: 'out.html', kernels: ['k', 'm'] }],
    [['a.kw', '--eigenvalues=8', '--eigenfunctions', '2', '--grid-points', '32', '--time-budget', '900'], { eigenCount: 8, eigenfunctions: 2, gridPoints: 32, timeBudgetMs: 900 }],
    [['--output', '-', '--', '-odd.kw'], { file: '-odd.kw', output: '-' }],
  ])('%j', (args, expected) => {
    const parsed = parseReportArgs(args);
    expect(parsed.kind).toBe('options');
    expect(parsed.kind === 'options' && parsed.options).toMatchObject(expected);
  });

  it.each([
    [[], /exactly one kernel file, got 0/],
    [['a.kw', 'b.kw'], /exactly one kernel file, got 2/],
    [['a.kw', '--format', 'json'], /unknown option '--format'/],
    [['a.kw', '--eigenfunctions', '5'], /--eigenfunctions needs a whole number from 1 to 4, got '5'/],
    [['a.kw', '--grid-points', '4'], /--grid-points needs a whole number from 8 to 200/],
    [['a.kw', '-o'], /option -o needs a value/],
    [['a.kw', '-o', 'x', '-o', 'y'], /given twice/],
  ])('%j is refused', (args, message) => {
    const parsed = parseReportArgs(args);
    expect(parsed.kind).toBe('error');
    expect(parsed.kind === 'error' && parsed.message).toMatch(message);
  });

  it('names the default output after the file, in the current folder', () => {
    expect(defaultReportPath('examples/heated-rod.kw')).toBe('heated-rod.html');
    expect(defaultReportPath('/x/y/Notes.KW')).toBe('Notes.html');
    expect(defaultReportPath('plain')).toBe('plain.html');
  });
});

describe('running report', () => {
  const source = `${header}domain [0, 1]   # m
kernel smooth(t, s) = exp(-(t - s)^2)
kernel tilted(t, s) = exp(-t) * s
`;

  it('writes one self-contained page with a section per kernel', async () => {
    const file = write('two.kw', source);
    const out = path.join(work, 'two.html');
    const s = io();
    const code = await runReportCommand([file, '-o', out, '--time-budget', '300', '--grid-points', '16'], s);
    expect(s.stderr).toEqual([]);
    expect(code).toBe(0);
    expect(s.stdout.join('')).toBe(`wrote ${out} (2 kernels, 8 figures)\n`);
    const html = readFileSync(out, 'utf8');
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html.match(/<section class="kw-kernel"/g)).toHaveLength(2);
    expect(html).toContain('t (m)');
    expect(html).not.toMatch(/<script|<link|src="http/);
  });

  it('prints the page with -o - and draws only the kernels asked for', async () => {
    const file = write('pick.kw', source);
    const s = io();
    expect(await runReportCommand([file, '-o', '-', '--kernel', 'tilted', '--time-budget', '300', '--grid-points', '8'], s)).toBe(0);
    const html = s.stdout.join('');
    expect(html.match(/<section class="kw-kernel"/g)).toHaveLength(1);
    expect(html).toContain('data-kind="defect"');
  });

  it('writes into the current folder by default', async () => {
    const file = write('here.kw', `${header}kernel k(t, s) on [0, 1] = t * s\n`);
    const cwd = process.cwd();
    const folder = path.join(work, 'cwd');
    mkdirSync(folder, { recursive: true });
    process.chdir(folder);
    try {
      expect(await runReportCommand([file, '--time-budget', '200', '--grid-points', '8'], io())).toBe(0);
      expect(existsSync(path.join(folder, 'here.html'))).toBe(true);
    } finally {
      process.chdir(cwd);
    }
  });

  it('shows a kernel with errors by its diagnostics, without pictures', async () => {
    const file = write('broken.kw', `${header}kernel k(t, s) on [0, 1] = t * nowhere\n`);
    const s = io();
    expect(await runReportCommand([file, '-o', '-'], s)).toBe(0);
    const html = s.stdout.join('');
    expect(html).toMatch(/line 2: error KW\d+/);
    expect(html).toContain('No pictures: the definition has errors');
    expect(html).not.toContain('<figure');
  });

  it.each([
    ['a missing file', ['missing.kw'], /cannot read '.*missing\.kw': no such file or folder/],
    ['a file without kernels', ['empty.kw'], /declares no kernel/],
    ['an unknown kernel', ['two.kw', '--kernel', 'nope'], /has no kernel named 'nope' \(kernels: smooth, tilted\)/],
    ['a folder that does not exist', ['two.kw', '-o', 'no/such/folder/out.html'], /cannot write the report to '.*out\.html': the folder '.*' does not exist/],
    ['bad usage', ['two.kw', '--jobs', '2'], /unknown option '--jobs'/],
  ])('exit 2 and one line for %s', async (_what, args, message) => {
    write('two.kw', source);
    write('empty.kw', `${header}const a = 1\n`);
    const s = io();
    const resolved = args.map((a, i) => (i === 0 || args[i - 1] === '-o' ? path.join(work, a) : a));
    expect(await runReportCommand(resolved, s)).toBe(2);
    expect(s.stdout).toEqual([]);
    expect(s.stderr).toHaveLength(1);
    expect(s.stderr[0]).toMatch(message);
  });

  it('prints its usage for --help', async () => {
    const s = io();
    expect(await runReportCommand(['--help'], s)).toBe(0);
    expect(s.stdout.join('')).toMatch(/^Usage: kernwright report <file>/);
  });
});
