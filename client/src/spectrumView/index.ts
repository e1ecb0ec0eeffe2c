/** The spectrum view (a webview panel with a kernel's pictures): what the extension's entry needs to wire it. */
export { registerSpectrumView, showSpectrumCommand } from './registerSpectrumView';
export { kernelDataRequest, kernelAtOffset, kernelNamed, type GetKernelData, type KernelDataParams, type KernelDataReply } from './kernelData';
export type { SpectrumViewOptions } from './spectrumPanel';
