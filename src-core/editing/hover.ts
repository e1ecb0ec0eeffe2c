/**
 * Hover contents as markdown, built from the analysis of a file: a kernel's figures and properties, a constant's
 * value, a helper's definition, a parameter's role, a claim's meaning and verdict, a built-in's signature.
 */
import type { Diagnostic } from '../diagnostics/types';
import type { FileAnalysis, KernelReport } from '../analysis/types';
import type { TextRange } from '../syntax/textRange';
import { printExpr } from '../syntax/printer';
import type { FileSymbol, KernelSymbol } from '../semantics/model';
import { builtinConstants, builtinFunctions } from '../semantics/builtins';
import { expectationInfo, isExpectationName } from '../semantics/expectations';
import { formatComplex } from '../semantics/values';
import { kernelFiguresMarkdown } from './figures';
import { nodeAt, type NodeAt } from './nodeAt';

/** Where the numerical analysis of the file stands, as far as the hover needs to know. */
export type NumericsState = 'ready' | 'pending' | 'off';

export interface HoverResult {
  readonly markdown: string;
  readonly range: TextRange;
}

export interface HoverOptions {
  readonly numerics?: NumericsState;
  /** How many leading eigenvalues to list. */
  readonly eigenvalues?: number;
}

const keywordHelp: Readonly<Record<string, string>> = {
  domain: '`domain [a, b]`: the default interval of every kernel in the file that does not name its own.',
  const: '`const NAME = expr`: a named constant, real or complex.',
  fn: '`fn NAME(x, ...) = expr`: a helper function of its parameters and the constants.',
  kernel: '`kernel NAME(t, s) [on [a, b]] = expr`: an integral kernel K(t, s); t is the output point, s the integration point.',
  expect: '`expect claim, ...`: claims about the kernel above, each checked against the numbers.',
};

function code(text: string): string {
  return '```kernwright\n' + text + '\n```';
}

function kernelSignature(k: KernelSymbol): string {
  const params = k.decl.params.map((p) => p.text).join(', ');
  const domain = k.domain ? ` on [${k.domain.a}, ${k.domain.b}]` : '';
  return `kernel ${k.name}(${params})${domain}`;
}

function kernelHover(k: KernelSymbol, report: KernelReport | undefined, analysis: FileAnalysis, options: HoverOptions): string {
  const parts = [code(kernelSignature(k))];
  const kind = report?.complex ?? k.ir?.complex ? 'complex-valued' : 'real-valued';
  const own = k.domain ? (k.domain.own ? 'its own domain' : 'the file’s domain') : 'no domain';
  const intro = `Integral kernel, ${kind}, on ${own}.`;
  // Property marks show even without a spectrum (an unbounded operator has none, and the marks say why).
  parts.push(...(report ? kernelFiguresMarkdown(report, options.eigenvalues ?? 4, intro) : [intro]));
  if (report?.spectrum) return parts.join('\n\n');
  if (options.numerics === 'pending') {
    parts.push('_Numerical analysis in progress…_');
  } else if (options.numerics === 'off') {
    parts.push('_Numerical analysis is switched off (setting `kernwright.numerics.enabled`)._');
  } else {
    const blocking = analysis.diagnostics.find((d) => d.severity === 'error' && d.range.start >= k.decl.range.start && d.range.end <= k.decl.range.end);
    parts.push(blocking ? `_Not analysed: ${blocking.message}_` : '_No spectrum for this kernel (see its diagnostics)._');
  }
  return parts.join('\n\n');
}

function symbolHover(sym: FileSymbol, analysis: FileAnalysis, options: HoverOptions): string {
  if (sym.kind === 'const') {
    const lines = [code(`const ${sym.name} = ${printExpr(sym.decl.value)}`)];
    if (sym.value) lines.push(`Value: \`${formatComplex(sym.value)}\` (exact to double precision)`);
    if (sym.decl.note) lines.push(`Note: ${sym.decl.note.trim()}`);
    lines.push(`Used ${sym.references.length} time${sym.references.length === 1 ? '' : 's'}.`);
    return lines.join('\n\n');
  }
  if (sym.kind === 'fn') {
    const text = `fn ${sym.name}(${sym.params.join(', ')}) = ${printExpr(sym.decl.body)}`;
    return [code(text), `Helper function of ${sym.params.length} argument${sym.params.length === 1 ? '' : 's'}.`].join('\n\n');
  }
  const report = analysis.kernels.find((r) => r.name === sym.name && r.nameRange.start === sym.nameRange.start)
    ?? analysis.kernels.find((r) => r.name === sym.name);
  return kernelHover(sym, report, analysis, options);
}

function overlaps(a: TextRange, b: TextRange): boolean {
  return a.start <= b.end && b.start <= a.end;
}

function expectationHover(node: Extract<NodeAt, { kind: 'expectation' }>, analysis: FileAnalysis, options: HoverOptions): string {
  const { item, kernel } = node;
  const written = analysis.source.text.slice(item.range.start, item.range.end);
  const parts = [code(`expect ${written}`)];
  if (!isExpectationName(item.name)) {
    parts.push(`“${item.name}” is not a known claim.`);
    return parts.join('\n\n');
  }
  parts.push(expectationInfo[item.name].description);
  const findings: Diagnostic[] = analysis.diagnostics.filter((d) => d.severity !== 'hint' && overlaps(d.range, item.range));
  const report = kernel ? analysis.kernels.find((r) => r.name === kernel.name) : undefined;
  if (findings.length > 0) {
    parts.push(findings.map((d) => `✗ **${d.code}** ${d.message}`).join('  \n'));
  } else if (options.numerics === 'pending') {
    parts.push('_Being checked…_');
  } else if (options.numerics === 'off') {
    parts.push('_Not checked: numerical analysis is switched off._');
  } else if (report?.spectrum) {
    parts.push('✓ Consistent with the numbers (a numerical test, not a proof).');
  } else {
    parts.push('_Not checked: the kernel has no spectrum._');
  }
  return parts.join('\n\n');
}

function describe(node: NodeAt, analysis: FileAnalysis, options: HoverOptions): string | null {
  switch (node.kind) {
    case 'symbol':
      return symbolHover(node.symbol, analysis, options);
    case 'parameter': {
      const owner = node.owner;
      const role = owner.kind === 'kernel'
        ? node.index === 0 ? ' (the output point t)' : node.index === 1 ? ' (the integration point s)' : ''
        : '';
      return `${code(`${node.name}`)}\n\nParameter ${node.index + 1} of ${owner.kind === 'kernel' ? 'kernel' : 'helper'} \`${owner.name.text}\`${role}.`;
    }
    case 'builtin-function': {
      const b = builtinFunctions[node.name];
      const notes = [b.realOnly ? 'Real arguments only.' : '', b.realResult ? 'Real result.' : ''].filter(Boolean).join(' ');
      return `${code(b.signature)}\n\n${b.description}${notes ? `\n\n${notes}` : ''}`;
    }
    case 'builtin-constant': {
      const c = builtinConstants[node.name];
      return `${code(node.name)}\n\n${c.description} Value: \`${formatComplex({ re: c.re, im: c.im })}\``;
    }
    case 'expectation':
      return expectationHover(node, analysis, options);
    case 'keyword':
      return keywordHelp[node.word] ?? null;
    case 'unresolved':
      return null;
  }
}

/** The hover at `offset`, or null when there is nothing to say. */
export function hoverAt(analysis: FileAnalysis, offset: number, options: HoverOptions = {}): HoverResult | null {
  const node = nodeAt(analysis.source, analysis.model, offset);
  if (!node) return null;
  const markdown = describe(node, analysis, options);
  return markdown ? { markdown, range: node.range } : null;
}
