/**
 * Editor logic that is not tied to a protocol: what is at an offset, hovers, completion, signature help,
 * navigation and rename, formatting, outline, folding, semantic classes and kernel figures as text. Plain data in
 * offsets; the language server converts it to LSP types, other front ends to theirs.
 */
export * from './nodeAt';
export * from './navigation';
export * from './hover';
export * from './figures';
export * from './completion';
export * from './signatureHelp';
export * from './format';
export * from './outline';
export * from './folding';
export * from './semanticTokens';
export * from './carryForward';
