// Public surface of the calculation engine: plain TypeScript, no framework imports.
export * from './engine-input-error';
export * from './units';
export * from './water';
export * from './jet';
export * from './jet-crossover';
export * from './jet-matched';
export * from './jet-equalising';
export * from './jet-equalising-matched';
export * from './parity-monte-carlo';
export * from './cavitation';
export * from './jet-uncertainty';
export * from './measurement';
export * from './conformity';
export * from './conformity-burden';
export * from './parity';
export * from './calculation-api';
