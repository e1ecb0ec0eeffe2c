/** Rendering the core's plot specifications to SVG with vega, in Node (command line and editor host). */
export { renderSvg, compileToVega, type RenderOptions } from './renderSvg';
export { renderKernelFigures, renderKernelSection, missingPicturesNote, type KernelPictureOptions } from './kernelPictures';
export { textWidth, charWidthEm } from './textWidth';
