/**
 * The HTML pages of the pictures, as pure functions: rendered SVG strings and figures in, one HTML string out.
 */
export { escapeHtml, slug } from './escape';
export { inlineSvg } from './inlineSvg';
export { figureHtml, tableHtml } from './figureHtml';
export { kernelSectionHtml, sectionId, type KernelSection, type SectionProperty } from './kernelSection';
export { figureCss, standaloneThemeCss } from './pageStyle';
export { reportPageHtml, reportContentSecurityPolicy, type ReportPage } from './reportPage';
