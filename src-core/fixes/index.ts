/** Text edits offered with diagnostics: symmetrize a kernel, declare a property that holds. */
export { symmetrizeFix, symmetrizedBody, hermitianPartText, swapNames, symmetrizeKind } from './symmetrize';
export { declareClaimsFix, declarePropertyKind } from './declareProperty';
