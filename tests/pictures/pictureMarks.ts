/**
 * Reading the drawn data back out of a rendered page: the eigenvalue points of a figure carry their exact values in
 * their aria-label (`λ3 = 0.0048 ± 6.5e-16`, or `λ3 = 0.1 + -0.2i ± 1e-9` in the complex plane), so a test can
 * compare what is drawn with what the engine computed, number for number.
 */
import type { Page } from 'playwright-core';

export interface DrawnEigenvalue {
  readonly k: number;
  readonly re: number;
  readonly im: number;
  readonly error: number;
}

const labelPattern = /^λ(\d+) = (\S+)(?: \+ (\S+)i)? ± (\S+)$/;

export function parseEigenLabel(label: string): DrawnEigenvalue | null {
  const m = labelPattern.exec(label);
  if (!m) return null;
  return { k: Number(m[1]), re: Number(m[2]), im: m[3] === undefined ? 0 : Number(m[3]), error: Number(m[4]) };
}

/** The eigenvalue points drawn inside `scope` (a CSS selector of a section or figure), in document order. */
export async function drawnEigenvalues(page: Page, scope: string): Promise<(DrawnEigenvalue | null)[]> {
  const labels = await page.$$eval(`${scope} g.eigenvalue_points_marks > path`, (paths) => paths.map((p) => p.getAttribute('aria-label') ?? ''));
  return labels.map(parseEigenLabel);
}

/** How many mark items (paths) a named mark group holds inside `scope`. */
export async function countMarks(page: Page, scope: string, markName: string): Promise<number> {
  return page.$$eval(`${scope} g.${markName}_marks > path`, (paths) => paths.length);
}
